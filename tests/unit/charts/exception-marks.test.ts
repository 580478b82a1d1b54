import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { gridJson } from "@/lib/charts/grid-model";
import { buildSnapshot, snapshotGrids, type LabStock } from "@/lib/charts/snapshot";
import { checkChartAgainstRules, DEFAULT_LAB_RULES, ruledDefinition, type LabRules } from "@/lib/labs/rules";
import { cardExceptionLine, exceptionLine } from "@/lib/poster/exceptions";
import { cellView } from "@/lib/poster/marks";
import { posterLegend } from "@/lib/poster/model";
import type { RoundingCaps } from "@/lib/sizing";
import { chartDefinitionSchema, type ChartDefinition } from "@/lib/validation/chart";
import { finetParent, murrayParent } from "@/tests/support/published-laws";

// Invented, illustrative stock: a POT family with a gap between 3.5 and 4.5 mm.
const stockWith = (diameters: number[], growth: number | null = null): LabStock => ({
  balloonFamilies: [
    {
      id: 1,
      name: "NC family (illustrative)",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: growth,
      balloons: diameters.map((d) => ({ diameterMm: d, inStock: true })),
    },
  ],
  stentPlatforms: [{ id: 7, name: "DES (illustrative)", sizes: [{ nominalMm: 3, maxPostDilatationMm: 5.75 }] }],
});

const chart = (caps: RoundingCaps, law: ChartDefinition["law"] = { law: "murray" }): ChartDefinition =>
  chartDefinitionSchema.parse({
    title: "POT with a stock gap",
    law,
    lookups: [
      {
        kind: "proximal",
        rows: { from: 2.5, to: 4, step: 0.25 },
        cols: { from: 2, to: 3.5, step: 0.25 },
        rounding: "up",
        familyId: 1,
      },
    ],
    stentPlatformId: 7,
    roundingCaps: caps,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
  });

const rulesWith = (labCaps: RoundingCaps, exceptions: LabRules["exceptions"] = []): LabRules => ({
  ...DEFAULT_LAB_RULES,
  lookups: { ...DEFAULT_LAB_RULES.lookups, proximal: { ...DEFAULT_LAB_RULES.lookups.proximal, caps: labCaps } },
  exceptions,
});

const snapshotFor = (def: ChartDefinition, stock: LabStock, rules: LabRules, chartId = 5) =>
  buildSnapshot({
    labName: "Lab (illustrative)",
    definition: def,
    stock,
    logoSha256: null,
    labLimits: rules.lookups,
    ruleExceptions: checkChartAgainstRules(chartId, ruledDefinition(def), rules).applied,
  });

describe("an exception excuses a wider cap; it never hides the mark", () => {
  const stock = stockWith([2.5, 2.75, 3, 3.25, 3.5, 4.5, 5]);
  const def = chart({ upMm: 0.5, downMm: 0.5 });
  const excepted = rulesWith({ upMm: 0.25, downMm: 0.5 }, [
    {
      chartId: 5,
      rule: "caps",
      reason: "Gap in stock accepted (illustrative)",
      recordedBy: "Lead",
      recordedOn: "2026-12-01",
    },
  ]);

  it("marks every cell more than the lab's cap above target, with the exception in force (Murray, PNAS 1926; cap: common practice)", () => {
    const snap = snapshotFor(def, stock, excepted);
    const cells = gridJson(snap).lookups[0]!.cells.flat();
    const beyond = cells.filter((c) => c.sizeMm !== null && c.exactMm !== null && c.sizeMm - c.exactMm > 0.25 + 1e-9);
    expect(beyond.length).toBeGreaterThan(0);
    for (const c of beyond) expect(c.marks, JSON.stringify(c)).toContain("oversize");
    // main 4.0 x side 2.0: Murray gives 4.068 mm, 4.5 mm is 0.43 mm above it.
    const row = snap.lookups[0]!.rows.indexOf(4);
    const col = snap.lookups[0]!.cols.indexOf(2);
    const cell = gridJson(snap).lookups[0]!.cells[row]![col]!;
    expect(cell.exactMm).toBeCloseTo(murrayParent(4, 2), 9);
    expect(cell.sizeMm).toBe(4.5);
    expect(cell.marks).toContain("oversize");
    expect(posterLegend(snap).map((e) => e.label)).toContainEqual(expect.stringContaining("↑"));
    expect(posterLegend(snap).find((e) => e.mark === "oversize")!.text).toContain("more than 0.25 mm above");
  });

  it("prints the exception with the cap it relaxes, who recorded it and the reason", () => {
    const snap = snapshotFor(def, stock, excepted);
    expect(snap.ruleExceptions).toHaveLength(1);
    const line = exceptionLine(snap.ruleExceptions![0]!);
    expect(line).toMatch(
      /^Caps exception: up to 0\.50 mm above target \(the lab's cap for a POT \(proximal\) lookup: 0\.25 mm/,
    );
    expect(line).toContain("recorded by Lead on 2026-12-01");
    expect(line).toContain("Reason: Gap in stock accepted (illustrative)");
    expect(cardExceptionLine(snap.ruleExceptions![0]!)).toContain("up to 0.50 mm above target");
  });

  it("without an exception the draft grid carries the same marks (rules bind, marks do not depend on approval)", () => {
    const plain = snapshotFor(def, stock, rulesWith({ upMm: 0.25, downMm: 0.5 }));
    const withEx = snapshotFor(def, stock, excepted);
    expect(gridJson(plain)).toEqual(gridJson(withEx));
  });

  it("a chart within the lab's caps freezes no extra field (fingerprints of compliant charts stay)", () => {
    const snap = snapshotFor(chart({ upMm: 0.25, downMm: 0.5 }), stock, rulesWith({ upMm: 0.25, downMm: 0.5 }));
    expect(snap.lookups[0]).not.toHaveProperty("caps");
  });
});

// Property: whatever the stock, the chart's caps, the lab's caps and the exceptions, a printed
// size further from the exact diameter than the lab's cap carries its mark in the grid API and on
// the poster. The exact diameter is computed here from the published law, not by the engine.
describe("no printed size beyond the lab's cap lacks its mark (property)", () => {
  const capArb = fc.integer({ min: 0, max: 40 }).map((n) => n / 40);
  const sizesArb = fc
    .uniqueArray(fc.integer({ min: 8, max: 24 }), { minLength: 1, maxLength: 12 })
    .map((a) => a.map((q) => q / 4).sort((x, y) => x - y));
  it("holds over random stock, caps and exceptions (Finet, EuroIntervention 2008; Murray, PNAS 1926)", () => {
    fc.assert(
      fc.property(
        sizesArb,
        fc.record({ upMm: capArb, downMm: capArb }),
        fc.record({ upMm: capArb, downMm: capArb }),
        fc.boolean(),
        fc.constantFrom("murray", "finet", "nearest-murray"),
        (sizes, chartCaps, labCaps, excepted, variant) => {
          const law: ChartDefinition["law"] = variant === "finet" ? { law: "finet", ratio: 0.678 } : { law: "murray" };
          const def = chart(chartCaps, law);
          if (variant === "nearest-murray") def.lookups[0]!.rounding = "nearest";
          const rules = rulesWith(
            labCaps,
            excepted ? [{ chartId: 5, rule: "caps", reason: "Property test (illustrative)" }] : [],
          );
          const snap = snapshotFor(def, stockWith(sizes), rules);
          const json = gridJson(snap).lookups[0]!;
          const grid = snapshotGrids(snap)[0]!;
          json.rows.forEach((mb, r) =>
            json.cols.forEach((sb, c) => {
              const cell = json.cells[r]![c]!;
              if (cell.sizeMm === null || cell.exactMm === null) return;
              const exact = law.law === "finet" ? finetParent(mb, sb) : murrayParent(mb, sb);
              expect(cell.exactMm).toBeCloseTo(exact, 9);
              const poster = cellView(grid.cells[r]![c]!).marks;
              if (cell.sizeMm - exact > labCaps.upMm + 1e-6) {
                expect(cell.marks).toContain("oversize");
                expect(poster).toContain("oversize");
              }
              if (exact - cell.sizeMm > labCaps.downMm + 1e-6) {
                expect(cell.marks).toContain("undersize");
                expect(poster).toContain("undersize");
              }
            }),
          );
        },
      ),
      { numRuns: 100 },
    );
  }, 60_000);
});
