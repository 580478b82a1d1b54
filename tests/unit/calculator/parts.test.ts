// The calculator's parts rendered to HTML on the server (no browser): what each shows and omits.
import { createElement as h } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ChartPicker } from "@/components/calculator/chart-picker";
import { LawFields } from "@/components/calculator/law-fields";
import { NumberField } from "@/components/calculator/number-field";
import { ResultPanel } from "@/components/calculator/result-panel";
import { chartOptions, readChoice, type CalculatorLab } from "@/lib/calculator/choice";
import { labCell, solveLocally } from "@/lib/calculator/local";
import { buildSnapshot, type LabStock } from "@/lib/charts/snapshot";
import { LAWS, LAW_IDS } from "@/lib/sizing";
import { chartDefinitionSchema } from "@/lib/validation/chart";

// Invented, illustrative stock for the tests only.
const stock: LabStock = {
  balloonFamilies: [
    {
      id: 1,
      name: "NC test family",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: null,
      balloons: [2.5, 3, 3.25, 3.5, 3.75, 4, 4.5].map((d) => ({ diameterMm: d, inStock: true })),
    },
  ],
  stentPlatforms: [],
};
const snapshot = buildSnapshot({
  labName: "Test lab",
  definition: chartDefinitionSchema.parse({
    title: "POT test chart",
    law: { law: "finet", ratio: 0.678 },
    lookups: [
      {
        kind: "proximal",
        rows: { from: 2.5, to: 3.5, step: 0.25 },
        cols: { from: 2, to: 3, step: 0.25 },
        rounding: "up",
        familyId: 1,
      },
    ],
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
  }),
  stock,
  logoSha256: null,
});
const lab = (current: boolean): CalculatorLab => ({
  slug: "t",
  name: "Test lab",
  isDemo: false,
  charts: [{ id: 7, title: "POT test chart", edition: { number: 3, approvedAt: null, current }, snapshot }],
});
const laws = LAW_IDS.map((id) => ({ id, name: LAWS[id].name, formula: LAWS[id].formula, source: LAWS[id].source }));
const html = (el: Parameters<typeof renderToStaticMarkup>[0]) => renderToStaticMarkup(el);

describe("the calculator's parts", () => {
  it("shows no result until there is an answer", () => {
    expect(html(h(ResultPanel, { answer: null, chosen: null }))).toBe("");
  });

  it("a published law's answer: the diameter with two decimals and the caution line", () => {
    // Finet 0.678 x (3.5 + 2.5) = 4.068 (Finet et al., EuroIntervention 2008).
    const out = html(
      h(ResultPanel, { answer: solveLocally({ law: "finet", ratio: "0.678", mb: "3.5", sb: "2.5" }), chosen: null }),
    );
    expect(out).toContain('data-testid="solve-result">4.07');
    expect(out).toContain("Reference aid only");
  });

  it("a refused input says why, with no number and no caution line of a result", () => {
    const out = html(
      h(ResultPanel, { answer: solveLocally({ law: "finet", ratio: "0.678", mb: "12", sb: "2.5" }), chosen: null }),
    );
    expect(out).toContain("Main branch: must be at most 10 mm");
    expect(out).not.toContain("solve-result");
  });

  it("a lab chart's answer names its edition, and warns when the lab changed since its approval", () => {
    for (const current of [true, false]) {
      const chosen = readChoice([lab(current)], "t:7:0")!;
      const out = html(
        h(ResultPanel, { answer: labCell(snapshot, chosen.lookup, { parent: "", mb: "3", sb: "2.5" }), chosen }),
      );
      // Finet 0.678 x 5.5 = 3.729 -> next stocked size up 3.75 mm.
      expect(out).toContain('data-testid="lab-size">3.75');
      expect(out).toContain("As edition 3 of Test lab");
      expect(out.includes("confirm the size"), String(current)).toBe(!current);
    }
  });

  it("offers each approved chart's lookups with the edition, and reads a choice back", () => {
    expect(chartOptions(lab(true))).toEqual([
      { value: "t:7:0", label: "POT test chart · edition 3 · POT balloon (parent) from main branch × side branch" },
    ]);
    expect(readChoice([lab(true)], "t:7:1")).toBeNull();
    expect(readChoice([lab(true)], "x:7:0")).toBeNull();
    const out = html(h(ChartPicker, { id: "p", labs: [lab(true)], value: "", onChange: () => undefined }));
    expect(out).toContain(">POT test chart · edition 3 · POT balloon (parent) from main branch × side branch</option>");
    expect(out).toContain('<optgroup label="Test lab">');
  });

  it("asks for the Finet ratio only under Finet and the exponent only under the power law", () => {
    const render = (law: string) =>
      html(
        h(LawFields, {
          id: "c",
          laws,
          state: { law, ratio: "0.678", n: "2.3", solveFor: "parent" },
          onChange: () => undefined,
          issueFor: () => undefined,
        }),
      );
    expect(render("finet")).toContain("Finet ratio");
    expect(render("finet")).not.toContain("Exponent n");
    expect(render("power")).toContain("Exponent n");
    expect(render("murray")).not.toMatch(/Finet ratio|Exponent n/);
  });

  it("a number field ties its refusal to the input", () => {
    const out = html(
      h(NumberField, {
        id: "f",
        label: "Main branch",
        value: "x",
        onChange: () => undefined,
        error: "Main branch: must be a number",
        className: "",
      }),
    );
    expect(out).toContain('aria-invalid="true"');
    expect(out).toContain('aria-describedby="f-err"');
    expect(out).toContain('id="f-err"');
    expect(
      html(
        h(NumberField, {
          id: "f",
          label: "Main branch",
          value: "3",
          onChange: () => undefined,
          error: undefined,
          className: "",
        }),
      ),
    ).not.toContain("f-err");
  });
});
