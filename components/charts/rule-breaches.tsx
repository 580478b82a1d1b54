"use client";

import { checkChartAgainstRules, RULE_LABELS, ruledDefinition, type LabRules, type RuleId } from "@/lib/labs/rules";
import type { ChartDefinition } from "@/lib/validation/chart";

/**
 * The lab rules the chart breaks as it stands in the designer, recomputed on every edit with the
 * same check the server runs on save and on approval, and the exceptions in force for it.
 */
export function RuleBreaches({
  definition,
  chartId,
  labRules,
}: {
  definition: ChartDefinition;
  chartId: number | null;
  labRules: LabRules;
}) {
  const { issues, applied } = checkChartAgainstRules(chartId ?? 0, ruledDefinition(definition), labRules);
  if (!issues.length && !applied.length) return null;
  return (
    <div data-testid="rule-breaches" className="mt-3 space-y-2 text-sm">
      {issues.length > 0 ? (
        <div role="alert" className="rounded-md border border-warn/60 bg-warn-soft px-4 py-3">
          <p className="font-semibold">! Outside the lab&apos;s rules: this chart cannot be saved as it stands</p>
          <ul className="mt-1 list-disc pl-5">
            {issues.map((i) => (
              <li key={`${i.rule}:${i.path.join(".")}`}>{i.message}</li>
            ))}
          </ul>
          <p className="mt-1">Change the chart, or ask the medical lead to record an exception for it with a reason.</p>
        </div>
      ) : null}
      {applied.length > 0 ? (
        <div role="status" className="rounded-md border border-line px-4 py-3">
          <p className="font-semibold">Exceptions in force (printed on the poster; the marks stay on the cells)</p>
          <ul className="mt-1 list-disc pl-5">
            {applied.map((e) => (
              <li key={e.rule}>
                {RULE_LABELS[e.rule as RuleId] ?? e.rule}
                {e.relaxes ? `: ${e.relaxes}` : ""}. Reason: {e.reason}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
