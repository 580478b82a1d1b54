// Which approved chart lookup the calculator answers as: the picker's options and the choice read back.
import type { Snapshot, SnapshotLookup } from "@/lib/charts/snapshot";
import { lookupTitle } from "@/lib/poster/labels";

export type CalculatorChart = {
  id: number;
  title: string;
  edition: { number: number; approvedAt: string | null; current: boolean };
  snapshot: Snapshot;
};
export type CalculatorLab = { slug: string; name: string; isDemo: boolean; charts: CalculatorChart[] };
export type Chosen = { lab: CalculatorLab; chart: CalculatorChart; lookup: SnapshotLookup };

/** "POT chart · edition 3 · POT balloon": each lookup of each approved chart, named with its edition. */
export function chartOptions(lab: CalculatorLab): { value: string; label: string }[] {
  return lab.charts.flatMap((c) =>
    c.snapshot.lookups.map((l, i) => ({
      value: `${lab.slug}:${c.id}:${i}`,
      label: `${c.title} · edition ${c.edition.number} · ${lookupTitle(l.kind)}`,
    })),
  );
}

/** The lab, chart and lookup an option's value stands for, or null. */
export function readChoice(labs: CalculatorLab[] | null, value: string): Chosen | null {
  if (!value || !labs) return null;
  const [slug, chartId, index] = value.split(":");
  const lab = labs.find((l) => l.slug === slug);
  const chart = lab?.charts.find((c) => String(c.id) === chartId);
  const lookup = chart?.snapshot.lookups[Number(index)];
  return lab && chart && lookup ? { lab, chart, lookup } : null;
}
