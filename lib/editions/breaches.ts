// The lab rules a frozen edition breaks, as approval checks them: the same pure rule check and
// legibility gate the approve operation runs, so the approval screen lists them before the click.
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkChartAgainstRules, ruledSnapshot, type LabRules } from "@/lib/labs/rules";
import { legibilityRefusal, LEGIBILITY_RULE } from "@/lib/poster/model";

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
