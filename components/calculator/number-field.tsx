/** A decimal input with its label and, when refused, the reason under it. */
export function NumberField(props: {
  id: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  error: string | undefined;
  className: string;
}) {
  return (
    <div>
      <label htmlFor={props.id} className="block text-base font-medium">
        {props.label}
      </label>
      <input
        id={props.id}
        inputMode="decimal"
        autoComplete="off"
        value={props.value}
        onChange={(e) => props.onChange(e.target.value)}
        aria-invalid={Boolean(props.error)}
        aria-describedby={props.error ? `${props.id}-err` : undefined}
        className={props.className}
      />
      {props.error ? (
        <p id={`${props.id}-err`} className="mt-1 text-base text-danger">
          {props.error}
        </p>
      ) : null}
    </div>
  );
}
