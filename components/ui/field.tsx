import type { InputHTMLAttributes, SelectHTMLAttributes } from "react";

const inputClass = "mt-1 w-full rounded-md border bg-white px-3 py-2 text-ink aria-[invalid=true]:border-danger";

type Common = { label: string; name: string; error?: string; hint?: string };

/** A labelled input whose error is announced with it (aria-describedby) and named in words. */
export function TextField({
  label,
  name,
  error,
  hint,
  id,
  className = "",
  ...input
}: Common & InputHTMLAttributes<HTMLInputElement>) {
  const fieldId = id ?? `field-${name}`;
  const describedBy =
    [hint ? `${fieldId}-hint` : null, error ? `${fieldId}-error` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className={className}>
      <label htmlFor={fieldId} className="block text-sm font-medium">
        {label}
      </label>
      <input
        id={fieldId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`${inputClass} ${error ? "border-danger" : "border-line-strong"}`}
        {...input}
      />
      {hint ? (
        <p id={`${fieldId}-hint`} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${fieldId}-error`} error={error} />
    </div>
  );
}

export function SelectField({
  label,
  name,
  error,
  hint,
  id,
  className = "",
  options,
  ...select
}: Common & SelectHTMLAttributes<HTMLSelectElement> & { options: { value: string; label: string }[] }) {
  const fieldId = id ?? `field-${name}`;
  return (
    <div className={className}>
      <label htmlFor={fieldId} className="block text-sm font-medium">
        {label}
      </label>
      <select
        id={fieldId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${fieldId}-error` : hint ? `${fieldId}-hint` : undefined}
        className={`${inputClass} ${error ? "border-danger" : "border-line-strong"}`}
        {...select}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {hint ? (
        <p id={`${fieldId}-hint`} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${fieldId}-error`} error={error} />
    </div>
  );
}

export function FieldError({ id, error }: { id: string; error?: string }) {
  if (!error) return null;
  return (
    <p id={id} className="mt-1 text-sm text-danger">
      <span aria-hidden>⚠ </span>
      {error}
    </p>
  );
}
