// The lab rules a frozen edition breaks, as approval checks them: the same pure rule check and
// legibility gate the approve operation runs, so the approval screen lists them before the click.
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkChartAgainstRules, type LabRules, type RuledChart } from "@/lib/labs/rules";
import { legibilityRefusal, LEGIBILITY_RULE } from "@/lib/poster/model";
import { DEFAULT_ROUNDING_CAPS } from "@/lib/sizing";

/** A frozen snapshot as the lab rules see it. */
export const ruledSnapshot = (s: Snapshot): RuledChart => ({
  law: s.law,
  lookups: s.lookups,
  caps: s.caps ?? DEFAULT_ROUNDING_CAPS,
});

export type Breach = { rule: string; message: string };

/** Every breach no exception waives: approval is refused while there is one. Pure. */
export function editionBreaches(chartId: number, snapshot: Snapshot, rules: LabRules): Breach[] {
  const { issues } = checkChartAgainstRules(chartId, ruledSnapshot(snapshot), rules);
  const illegible = legibilityRefusal(snapshot);
  return [
    ...issues.map((i) => ({ rule: i.rule, message: i.message })),
    ...(illegible ? [{ rule: LEGIBILITY_RULE, message: illegible }] : []),
  ];
}
