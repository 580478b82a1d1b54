import type { ReactNode } from "react";
import { parseDecimalText } from "@/lib/stock/format";

export const inputClass =
  "mt-1 w-full rounded-md border border-line-strong bg-white px-3 py-2 aria-[invalid=true]:border-danger";

/** A labelled control with its hint and error, tied together for screen readers. */
export function FormField({
  id,
  label,
  hint,
  error,
  children,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: ReactNode;
}) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm text-danger">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export const describedBy = (id: string, hint?: string, error?: string) =>
  [hint ? `${id}-hint` : "", error ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined;

/** Form text -> number for the zod schemas: "" is missing, a decimal comma is accepted. */
export function numberFromInput(value: unknown): number | undefined {
  return typeof value === "number" ? value : parseDecimalText(String(value ?? ""));
}
