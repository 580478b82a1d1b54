import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { describeChanges } from "@/lib/charts/changes";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { buildSnapshot, relevantDiameters, snapshotGrids } from "@/lib/charts/snapshot";
import { buildGrid, pickBalloon, type BalloonFamilyStock } from "@/lib/sizing";
import { type ChartDefinition } from "@/lib/validation/chart";
import { ncStock, smallPotChart, steps } from "../../support/chart-fixtures";

const stock = (outOfStock: number[] = []) =>
  ncStock(outOfStock, {
    stentPlatforms: [
      {
        id: 7,
        name: "Test DES",
        sizes: [
          { nominalMm: 3, maxPostDilatationMm: 4.5 },
          { nominalMm: 2.5, maxPostDilatationMm: 3.5 },
        ],
      },
    ],
  });
const definition: ChartDefinition = { ...smallPotChart(1), stentPlatformId: 7 };

const snap = (outOfStock: number[] = [], def = definition) =>
  buildSnapshot({ labName: "Test lab", definition: def, stock: stock(outOfStock), logoSha256: null });

describe("relevantDiameters", () => {
  it("keeps the sizes between the targets plus the nearest size beyond each end", () => {
    expect(relevantDiameters(steps(2, 5), [3.1, 3.6], null)).toEqual([3, 3.25, 3.5, 3.75]);
    expect(relevantDiameters(steps(2, 5), [3.1, 3.6], 0.2)).toEqual([2.75, 3, 3.25, 3.5, 3.75]);
    expect(relevantDiameters([4, 4.5], [2.2], null)).toEqual([4]);
    expect(relevantDiameters([2, 2.5], [4.2], null)).toEqual([2.5]);
  });

  it("never changes a pick: every rule gives the same balloon from the subset as from the whole stock", () => {
    const size = fc.integer({ min: 100, max: 700 }).map((h) => h / 100);
    fc.assert(
      fc.property(
        fc.uniqueArray(size, { minLength: 1, maxLength: 20 }),
        fc.array(size, { minLength: 1, maxLength: 20 }),
        fc.constantFrom("up", "down", "nearest", "reach" as const),
        fc.option(
          fc.integer({ min: 0, max: 100 }).map((g) => g / 100),
          { nil: null },
        ),
        (inStock, targets, rule, growth) => {
          const family = (diameters: number[]): BalloonFamilyStock => ({
            name: "f",
            compliance: "nc",
            nominalAtm: 10,
            rbpAtm: 18,
            growthAtRbpMm: growth,
            diameters,
          });
          const subset = relevantDiameters(inStock, targets, rule === "reach" ? growth : null);
          for (const t of targets)
            expect(pickBalloon(t, family(subset), rule)).toEqual(pickBalloon(t, family(inStock), rule));
        },
      ),
      { numRuns: 400 },
    );
  });
});

describe("buildSnapshot and fingerprint", () => {
  it("is deterministic and its grids equal the grid model fed the whole stock", () => {
    const a = snap();
    expect(fingerprintOf(a)).toBe(fingerprintOf(snap()));
    const [grid] = snapshotGrids(a);
    const direct = buildGrid({
      kind: "proximal",
      rows: { from: 2.5, to: 3.5, step: 0.25 },
      cols: { from: 2, to: 3, step: 0.25 },
      law: { law: "finet", ratio: 0.678 },
      rounding: "up",
      family: {
        name: "NC test family",
        compliance: "nc",
        nominalAtm: 12,
        rbpAtm: 20,
        growthAtRbpMm: 0.2,
        diameters: steps(2, 5),
      },
      stent: stock().stentPlatforms[0]!.sizes,
    });
    expect(grid!.cells).toEqual(direct.cells);
  });

  it("changes when a size the chart can print goes out of stock, and not for a size it never reaches", () => {
    const base = fingerprintOf(snap());
    // Finet parents for MB 2.5-3.5 and SB 2.0-3.0 lie between 3.05 and 4.41 mm.
    expect(fingerprintOf(snap([3.75]))).not.toBe(base);
    expect(fingerprintOf(snap([2]))).toBe(base);
    expect(fingerprintOf(snap([5]))).toBe(base);
  });

  it("is independent of key order (canonical JSON)", () => {
    const s = snap();
    const reverseKeys = (v: unknown): unknown =>
      Array.isArray(v)
        ? v.map(reverseKeys)
        : v && typeof v === "object"
          ? Object.fromEntries(
              Object.entries(v)
                .reverse()
                .map(([k, x]) => [k, reverseKeys(x)]),
            )
          : v;
    const reordered = reverseKeys(s) as object;
    expect(JSON.stringify(reordered)).not.toBe(JSON.stringify(s));
    expect(fingerprintOf(reordered)).toBe(fingerprintOf(s));
  });
});

describe("describeChanges", () => {
  it("names a size no longer stocked in plain words", () => {
    expect(describeChanges(snap(), snap([3.25]))).toContainEqual({
      kind: "stock",
      detail: "3.25 mm NC balloon no longer stocked (NC test family)",
    });
  });

  it("names a law change", () => {
    const now = snap([], { ...definition, law: { law: "huo-kassab" } });
    expect(describeChanges(snap(), now)[0]).toEqual({
      kind: "law",
      detail: "Law changed from Finet (ratio 0.678) to Huo-Kassab",
    });
  });

  it("finds nothing when nothing changed", () => {
    expect(describeChanges(snap(), snap())).toEqual([]);
  });

  it("says when a stent limit changed", () => {
    const def = { ...definition };
    const s2 = buildSnapshot({
      labName: "Test lab",
      definition: def,
      stock: {
        ...stock(),
        stentPlatforms: [
          {
            id: 7,
            name: "Test DES",
            sizes: [
              { nominalMm: 3, maxPostDilatationMm: 4.25 },
              { nominalMm: 2.5, maxPostDilatationMm: 3.5 },
            ],
          },
        ],
      },
      logoSha256: null,
    });
    expect(describeChanges(snap(), s2)).toEqual([
      { kind: "stent", detail: "Test DES: 3.00 mm stent's maximum post-dilatation changed from 4.50 mm to 4.25 mm" },
    ]);
  });
});
