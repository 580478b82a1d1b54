import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ChartPreview } from "@/components/charts/chart-preview";
import { RuleBreaches } from "@/components/charts/rule-breaches";
import { gridJson } from "@/lib/charts/grid-model";
import { buildSnapshot } from "@/lib/charts/snapshot";
import { checkChartAgainstRules, DEFAULT_LAB_RULES, ruledDefinition, type LabRules } from "@/lib/labs/rules";
import { cellView, cornerSymbols } from "@/lib/poster/marks";
import { snapshotGrids } from "@/lib/charts/snapshot";
import { chartDefinitionSchema, type ChartDefinition } from "@/lib/validation/chart";
import { demoStock, potDefinition } from "@/tests/support/poster-fixtures";

const text = (html: string) => html.replace(/&#x27;/g, "'").replace(/&quot;/g, '"');
const def = (over: Partial<ChartDefinition>): ChartDefinition =>
  chartDefinitionSchema.parse({ ...potDefinition, ...over });
const breaches = (d: ChartDefinition, rules: LabRules, chartId: number | null = 9) =>
  text(renderToStaticMarkup(createElement(RuleBreaches, { definition: d, chartId, labRules: rules })));

describe("the designer lists the lab rules a chart breaks as it is edited", () => {
  it("names each breach: exponent outside the range, caps above the lab's, POT without a stent platform", () => {
    const html = breaches(
      def({ law: { law: "power", n: 1.6 }, roundingCaps: { upMm: 0.5, downMm: 0.5 }, stentPlatformId: null }),
      DEFAULT_LAB_RULES,
    );
    expect(html).toContain('data-testid="rule-breaches"');
    expect(html).toContain('Lab rule "power-law exponent range"');
    expect(html).toContain('Lab rule "rounding caps"');
    expect(html).toContain('Lab rule "POT checked against a stent platform"');
  });

  it("shows an exception in force with what it relaxes, and says nothing for a chart within the rules", () => {
    const rules: LabRules = {
      ...DEFAULT_LAB_RULES,
      exceptions: [{ chartId: 9, rule: "caps", reason: "Gap accepted (illustrative)" }],
    };
    const html = breaches(def({ roundingCaps: { upMm: 0.5, downMm: 0.5 } }), rules);
    expect(html).not.toContain('role="alert"');
    expect(html).toContain("up to 0.50 mm above target");
    expect(html).toContain("Reason: Gap accepted (illustrative)");
    expect(breaches(def({}), DEFAULT_LAB_RULES)).toBe("");
  });

  it("the designer preview, the grid API and the poster agree cell for cell, marks against the lab's caps", () => {
    const d = def({ roundingCaps: { upMm: 0.5, downMm: 0.5 } });
    const rules: LabRules = {
      ...DEFAULT_LAB_RULES,
      exceptions: [{ chartId: 9, rule: "caps", reason: "Gap accepted (illustrative)" }],
    };
    const snap = buildSnapshot({
      labName: "Illustrative lab",
      definition: d,
      stock: demoStock,
      logoSha256: null,
      labLimits: rules.lookups,
      ruleExceptions: checkChartAgainstRules(9, ruledDefinition(d), rules).applied,
    });
    const api = gridJson(snap).lookups[0]!;
    const oversize = api.cells.flat().filter((c) => c.marks.includes("oversize")).length;
    expect(oversize).toBeGreaterThan(0);
    const html = text(
      renderToStaticMarkup(
        createElement(ChartPreview, {
          definition: d,
          stock: demoStock,
          labName: "Illustrative lab",
          logoSha256: null,
          labRules: rules,
          chartId: 9,
        }),
      ),
    );
    // Every poster cell with the ↑ mark is one the grid API marks, and the preview shows as many.
    const grid = snapshotGrids(snap)[0]!;
    const posterUp = grid.cells.flat().filter((c) => cornerSymbols(cellView(c)).includes("↑")).length;
    expect(posterUp).toBe(oversize);
    // Each cell carries its words once as a hover title and once for screen readers.
    expect(html.match(/title="[^"]*Above the rounding cap:/g)?.length).toBe(oversize);
  });
});
