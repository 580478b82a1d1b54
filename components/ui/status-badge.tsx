import type { EditionStatus } from "@/lib/editions/states";

// Each status has a word and a symbol, never colour alone.
const STYLES: Record<EditionStatus | "outdated" | "current" | "none", { label: string; symbol: string; cls: string }> =
  {
    current: { label: "Current", symbol: "✓", cls: "border-ok/40 bg-ok-soft text-ok" },
    approved: { label: "Approved", symbol: "✓", cls: "border-ok/40 bg-ok-soft text-ok" },
    draft: { label: "Draft", symbol: "✎", cls: "border-line-strong bg-paper-sunk text-ink-soft" },
    returned: { label: "Sent back", symbol: "↩", cls: "border-warn/50 bg-warn-soft text-warn" },
    outdated: { label: "Outdated", symbol: "!", cls: "border-warn/50 bg-warn-soft text-warn" },
    superseded: { label: "Superseded", symbol: "↻", cls: "border-warn/50 bg-warn-soft text-warn" },
    withdrawn: { label: "Withdrawn", symbol: "✕", cls: "border-danger/40 bg-danger-soft text-danger" },
    none: { label: "No edition", symbol: "–", cls: "border-line bg-white text-ink-faint" },
  };

export function StatusBadge({ status, label }: { status: keyof typeof STYLES; label?: string }) {
  const s = STYLES[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2.5 py-0.5 text-xs font-semibold ${s.cls}`}>
      <span aria-hidden>{s.symbol}</span>
      {label ?? s.label}
    </span>
  );
}
