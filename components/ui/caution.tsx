import { cautionFor } from "@/lib/cautions";

/** The clinical caution shown wherever a number is shown; the demo clause only for demo labs. */
export function Caution({ className = "", demo = false }: { className?: string; demo?: boolean }) {
  return (
    <aside
      role="note"
      aria-label="Clinical caution"
      className={`rounded-md border border-warn/40 bg-warn-soft px-4 py-3 text-sm text-ink ${className}`}
    >
      <strong className="font-semibold">Caution: </strong>
      {cautionFor(demo)}
    </aside>
  );
}
