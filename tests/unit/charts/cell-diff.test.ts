import { describe, expect, it } from "vitest";
import { diffCells } from "@/lib/charts/cell-diff";
import { buildSnapshot, type LabStock } from "@/lib/charts/snapshot";
import { chartDefinitionSchema } from "@/lib/validation/chart";

// Invented, illustrative stock for the tests only.
const steps = (from: number, to: number, step = 0.25) =>
  Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => Math.round((from + i * step) * 100) / 100);
const stock = (outOfStock: number[] = []): LabStock => ({
  balloonFamilies: [
    {
      id: 1,
      name: "NC test family",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: 0.2,
      balloons: steps(2, 5).map((d) => ({ diameterMm: d, inStock: !outOfStock.includes(d) })),
    },
  ],
  stentPlatforms: [],
});
const definition = chartDefinitionSchema.parse({
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
});
const snap = (out: number[] = []) =>
  buildSnapshot({ labName: "Test lab", definition, stock: stock(out), logoSha256: null });
const withRatio = (ratio: number) =>
  buildSnapshot({
    labName: "Test lab",
    definition: { ...definition, law: { law: "finet", ratio } },
    stock: stock(),
    logoSha256: null,
  });

describe("diffCells", () => {
  it("finds no difference between a snapshot and itself", () => {
    expect(diffCells(snap(), snap())).toEqual([]);
  });

  it("names exactly the cells whose printed balloon changes when a size leaves stock, with both values", () => {
    const before = snap();
    const after = snap([3.75]);
    const diff = diffCells(before, after);
    expect(diff.length).toBeGreaterThan(0);
    // Every cell that printed 3.75 mm now prints something else, and no other cell changed.
    for (const d of diff) {
      expect(d.printed.text).toMatch(/^3\.75 mm/);
      expect(d.other?.text).not.toMatch(/^3\.75 mm/);
      expect(d.where).toMatch(/^Main branch \d\.\d+ mm × side branch \d\.\d+ mm$/);
    }
    expect(diff[0]!.other!.text).toMatch(/^4\.0 mm/);
  });

  it("counts every printed cell as affected when there is nothing to compare with", () => {
    const s = snap();
    const cells = s.lookups[0]!.rows.length * s.lookups[0]!.cols.length;
    const diff = diffCells(s, null);
    expect(diff).toHaveLength(cells);
    expect(diff.every((d) => d.other === null)).toBe(true);
  });

  it("lists only cells a reader can see differ: where the balloon is the same, the small print says what changed", () => {
    const diff = diffCells(withRatio(0.678), withRatio(0.69));
    expect(diff.length).toBeGreaterThan(0);
    for (const d of diff) expect(d.printed.text, d.where).not.toBe(d.other?.text);
    // A slightly larger ratio moves exact diameters without always moving the balloon.
    const sameBalloon = diff.filter((d) => d.printed.text.split(" (")[0] === d.other?.text.split(" (")[0]);
    expect(sameBalloon.length).toBeGreaterThan(0);
    for (const d of sameBalloon) {
      expect(d.printed.text).toMatch(/\(.*exact \d\.\d\d mm/);
      expect(d.other?.text).toMatch(/\(.*exact \d\.\d\d mm/);
    }
  });
});
