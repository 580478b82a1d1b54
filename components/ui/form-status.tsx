/** The outcome of a form: announced to screen readers, marked with a word and a sign, not colour alone. */
export function FormStatus({ ok, message, className = "" }: { ok?: boolean; message?: string; className?: string }) {
  if (!message) return null;
  return ok ? (
    <p role="status" className={`rounded-md border border-ok/40 bg-ok-soft px-3 py-2 text-sm text-ink ${className}`}>
      <span aria-hidden>✓ </span>
      {message}
    </p>
  ) : (
    <p
      role="alert"
      className={`rounded-md border border-danger/40 bg-danger-soft px-3 py-2 text-sm text-danger ${className}`}
    >
      <span aria-hidden>⚠ </span>
      {message}
    </p>
  );
}
