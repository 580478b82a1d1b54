// Four eyes: whoever changed what an edition prints since its chart's last approval may not
// approve it. Changes come through the chart itself, the lab's stock (by the person or a machine
// token they created) and the lab rules (an exception they recorded for the chart). Pure: fed by
// read-only queries (db/queries/four-eyes.ts) inside the approval's transaction.
import { describeAction } from "@/lib/audit/describe";
import type { Snapshot } from "@/lib/charts/snapshot";

export type FourEyesFacts = {
  approverId: number;
  chartId: number;
  draft: { createdBy: number | null; snapshot: Snapshot };
  /** The snapshot of the chart's most recently approved edition; null when none was ever approved. */
  lastApproved: Snapshot | null;
  /** The approver's chart content audit rows (create, update, logo) since the last approval. */
  chartChanges: { action: string }[];
  /** Stock audit rows since the last approval by the approver or a token they created. */
  stockChanges: { action: string; detail: unknown }[];
  /** `lab.rules_updated` audit rows by the approver since the last approval. */
  rulesChanges: { detail: unknown }[];
};

type ExceptionRow = { chartId?: unknown; rule?: unknown; reason?: unknown };

const exceptionsOf = (side: unknown, chartId: number): string[] => {
  const list = (side as { exceptions?: unknown } | null | undefined)?.exceptions;
  if (!Array.isArray(list)) return [];
  return (list as ExceptionRow[])
    .filter((e) => Number(e?.chartId) === chartId)
    .map((e) => `${String(e.rule)}: ${String(e.reason ?? "")}`);
};

/** The exceptions for `chartId` that a rules change added, altered or removed (as "rule: reason"). */
export function exceptionsTouched(detail: unknown, chartId: number): string[] {
  const d = detail as { before?: unknown; after?: unknown } | null;
  const before = exceptionsOf(d?.before, chartId);
  const after = exceptionsOf(d?.after, chartId);
  return [...after.filter((e) => !before.includes(e)), ...before.filter((e) => !after.includes(e))];
}

// The parts of a snapshot that the stock decides: each lookup's family sizes and the stent sizes.
const stockPart = (s: Snapshot) => JSON.stringify([s.lookups.map((l) => l.family), s.stent]);

const listed = (items: string[], max = 3) => {
  const unique = [...new Set(items)];
  const shown = unique.slice(0, max).join("; ");
  return unique.length > max ? `${shown}; and ${unique.length - max} more` : shown;
};

/** What the approver changed that this edition prints, in words; empty when nothing. */
export function changesByApprover(f: FourEyesFacts): string[] {
  const out: string[] = [];
  if (f.chartChanges.length) out.push(`the chart (${listed(f.chartChanges.map((c) => describeAction(c.action)))})`);
  // A stock change counts when what the stock gives this chart differs from the last approved
  // edition (or nothing was approved yet): then the draft prints what the approver's stock made.
  const stockMoved = f.lastApproved === null || stockPart(f.lastApproved) !== stockPart(f.draft.snapshot);
  if (f.stockChanges.length && stockMoved) {
    const said = f.stockChanges.map((c) => {
      const summary = (c.detail as { summary?: unknown } | null)?.summary;
      return typeof summary === "string" && summary ? summary : describeAction(c.action);
    });
    out.push(`the lab's stock (${listed(said)})`);
  }
  const exceptions = f.rulesChanges.flatMap((r) => exceptionsTouched(r.detail, f.chartId));
  if (exceptions.length) out.push(`the lab rules' exceptions for this chart (${listed(exceptions)})`);
  return out;
}

/** Why the approver may not approve this draft (the 403's message), or null when they may. */
export function fourEyesRefusal(f: FourEyesFacts): string | null {
  if (f.draft.createdBy === f.approverId)
    return "You drafted this edition, so someone else must approve it (four eyes).";
  const changes = changesByApprover(f);
  if (changes.length === 0) return null;
  return `Since this chart's last approved edition you changed ${changes.join(", ")}, so someone else must approve this edition (four eyes).`;
}
