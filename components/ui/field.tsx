import type { ComponentProps, ReactNode } from "react";

// The one field kit: every form (server-action forms and react-hook-form dialogs) labels its
// controls, ties hint and error to them for screen readers, and names errors in words.

export const inputClass =
  "mt-1 min-h-11 w-full rounded-md border border-line-strong bg-white px-3 py-2 text-ink disabled:bg-paper-sunk aria-[invalid=true]:border-danger";

type Common = { label: ReactNode; error?: string; hint?: ReactNode; className?: string };

/** The ids a control points at with aria-describedby: its hint and its error, when shown. */
export const describedBy = (id: string, hint?: unknown, error?: string) =>
  [hint ? `${id}-hint` : "", error ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined;

/** A label, a control (`children`, already given `id`), its hint and its error. */
export function Field({
  id,
  label,
  hint,
  error,
  className = "",
  children,
}: Common & { id: string; children: ReactNode }) {
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${id}-error`} error={error} />
    </div>
  );
}

/** A labelled input; spreads the rest onto <input>, so `{...register("x")}` (with its ref) works. */
export function TextField({ label, error, hint, id, name, className, ...input }: Common & ComponentProps<"input">) {
  const fieldId = id ?? `field-${name}`;
  return (
    <Field id={fieldId} label={label} hint={hint} error={error} className={className}>
      <input
        id={fieldId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={inputClass}
        {...input}
      />
    </Field>
  );
}

export function SelectField({
  label,
  error,
  hint,
  id,
  name,
  className,
  options,
  ...select
}: Common & ComponentProps<"select"> & { options: readonly { value: string; label: string }[] }) {
  const fieldId = id ?? `field-${name}`;
  return (
    <Field id={fieldId} label={label} hint={hint} error={error} className={className}>
      <select
        id={fieldId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={inputClass}
        {...select}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Field>
  );
}

/** A checkbox with its label after it. */
export function CheckboxField({
  label,
  id,
  name,
  className = "",
  ...input
}: { label: ReactNode; className?: string } & ComponentProps<"input">) {
  const fieldId = id ?? `field-${name}`;
  return (
    <div className={`flex items-center gap-2 ${className}`}>
      <input id={fieldId} name={name} type="checkbox" className="h-4 w-4" {...input} />
      <label htmlFor={fieldId} className="text-sm font-medium">
        {label}
      </label>
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
