import { CAUTION_TEXT } from "@/lib/cautions";

/** The clinical caution shown wherever a number is shown (PRODUCT.md). */
export function Caution({ className = "" }: { className?: string }) {
  return (
    <aside
      role="note"
      aria-label="Clinical caution"
      className={`rounded-md border border-warn/40 bg-warn-soft px-4 py-3 text-sm text-ink ${className}`}
    >
      <strong className="font-semibold">Caution: </strong>
      {CAUTION_TEXT}
    </aside>
  );
}
