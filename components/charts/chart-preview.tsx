"use client";

import { GridPreview } from "@/components/poster/grid-preview";
import { fitAdvice } from "@/lib/charts/grid-model";
import { chartRuleIssues } from "@/lib/charts/rules";
import { buildSnapshot, snapshotGrids, type LabStock } from "@/lib/charts/snapshot";
import { checkChartAgainstRules, ruledDefinition, type LabRules } from "@/lib/labs/rules";
import { stockGaps } from "@/lib/charts/stock-gaps";
import { snapshotLegibility } from "@/lib/poster/model";
import { PAPERS } from "@/lib/poster/paper";
import { lawFormula, lawName } from "@/lib/sizing";
import type { ChartDefinition } from "@/lib/validation/chart";

/**
 * The designer's live preview: the same snapshot and grid model the poster PDF prints, computed
 * in the browser as the form changes, with the legibility check for the stated reading distance.
 */
export function ChartPreview({
  definition,
  stock,
  labName,
  logoSha256,
  labRules,
  chartId = null,
}: {
  definition: ChartDefinition;
  stock: LabStock;
  labName: string;
  logoSha256: string | null;
  /** The lab's rules: marks are drawn against its caps, as the poster draws them. */
  labRules?: LabRules;
  chartId?: number | null;
}) {
  const snapshot = buildSnapshot({
    labName,
    definition,
    stock,
    logoSha256,
    ...(labRules
      ? {
          labLimits: labRules.lookups,
          ruleExceptions: checkChartAgainstRules(chartId ?? 0, ruledDefinition(definition), labRules).applied,
        }
      : {}),
  });
  const grids = snapshotGrids(snapshot);
  const legibility = snapshotLegibility(snapshot);
  const rules = chartRuleIssues(definition, stock);
  const fit = fitAdvice(snapshot);
  const gaps = stockGaps(snapshot, stock);
  return (
    <div className="mt-3 space-y-6">
      {rules.length > 0 ? (
        <div
          role="alert"
          data-testid="rule-problems"
          className="rounded-md border border-warn/60 bg-warn-soft px-4 py-3 text-sm"
        >
          <p className="font-semibold">! This chart breaks a lookup rule and cannot be saved or printed</p>
          <ul className="mt-1 list-disc pl-5">
            {rules.map((r) => (
              <li key={r.path.join(".")}>{r.message}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {fit.length > 0 ? (
        <div
          role="status"
          data-testid="fit-advice"
          className="rounded-md border border-warn/60 bg-warn-soft px-4 py-3 text-sm"
        >
          <p className="font-semibold">! Mostly outside the law&apos;s published fit</p>
          {fit.map((f) => (
            <p key={f.lookupIndex} className="mt-1">
              {f.message}
            </p>
          ))}
        </div>
      ) : null}
      {gaps.length > 0 ? (
        <div role="status" data-testid="stock-gaps" className="rounded-md border px-4 py-3 text-sm">
          <p className="font-semibold">Gaps in stock behind the ↑ oversize and ↓ undersize cells</p>
          <ul className="mt-1 list-disc pl-5">
            {gaps.slice(0, 6).map((g) => (
              <li key={`${g.lookupIndex}-${g.diameterMm}`}>{g.message}</li>
            ))}
          </ul>
        </div>
      ) : null}
      <div
        role="status"
        data-testid="legibility"
        className={`rounded-md border px-4 py-3 text-sm ${legibility.ok ? "border-ok/40 bg-ok-soft" : "border-warn/60 bg-warn-soft"}`}
      >
        <p className="font-semibold">
          {legibility.ok ? "✓ Legible at the stated distance" : "! Too small to read at the stated distance"}
        </p>
        <p className="mt-1 tabular-nums">
          Figures {legibility.figureHeightMm.toFixed(1)} mm high on {PAPERS[definition.paper].label}{" "}
          {definition.orientation}; at {definition.readingDistanceM} m they subtend{" "}
          {legibility.subtendedArcmin.toFixed(1)}′ of arc (the guide is 20′, which needs{" "}
          {legibility.requiredMm.toFixed(1)} mm). Legible to {legibility.maxDistanceM.toFixed(1)} m.
        </p>
        {legibility.suggestion ? <p className="mt-1">{legibility.suggestion}</p> : null}
      </div>
      <p className="text-sm text-ink-soft">
        {lawName(definition.law)}: <span className="font-mono">{lawFormula(definition.law)}</span>
      </p>
      {grids.map((grid, i) => (
        <GridPreview
          key={grid.kind}
          grid={grid}
          family={snapshot.lookups[i]!.family}
          stentName={grid.kind === "proximal" ? (snapshot.stent?.name ?? null) : null}
          caution={i === grids.length - 1}
        />
      ))}
    </div>
  );
}
