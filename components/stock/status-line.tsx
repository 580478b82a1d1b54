export type Status = { kind: "ok" | "error"; text: string };

/** One live line under a table saying what just happened (or went wrong), in words and a mark. */
export function StatusLine({ status }: { status: Status | null }) {
  return (
    <div aria-live="polite" role="status" className="min-h-6 text-sm">
      {status ? (
        <p className={status.kind === "ok" ? "text-ok" : "font-medium text-danger"}>
          <span aria-hidden>{status.kind === "ok" ? "✓ " : "⚠ "}</span>
          {status.text}
        </p>
      ) : null}
    </div>
  );
}
