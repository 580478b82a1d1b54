import Decimal from "decimal.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMO_CLAUSE } from "@/lib/cautions";
import { fitAdvice, gridJson, outsideFitShare } from "@/lib/charts/grid-model";
import { assertChartRules, chartRuleIssues } from "@/lib/charts/rules";
import { buildSnapshot, snapshotGrids, type LabStock } from "@/lib/charts/snapshot";
import { stockGaps } from "@/lib/charts/stock-gaps";
import { AppError } from "@/lib/errors";
import { gridSubtitle } from "@/lib/poster/labels";
import {
  buildGrid,
  formatDecimal,
  formatExactMm,
  formatSizeMm,
  GRID_MARKS,
  type BalloonFamilyStock,
  type StentSize,
} from "@/lib/sizing";
import { chartDefinitionSchema, chartPatchSchema } from "@/lib/validation/chart";

// Invented, illustrative stock for these tests only: no real device's data.
const steps = (from: number, to: number, step = 0.25) =>
  Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => Math.round((from + i * step) * 100) / 100);

const stock: LabStock = {
  balloonFamilies: [
    {
      id: 1,
      name: "Illustrative NC",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm: 0.2,
      balloons: steps(2, 5).map((d) => ({ diameterMm: d, inStock: d !== 3.25 })),
    },
    {
      id: 2,
      name: "Illustrative SC",
      compliance: "sc",
      nominalAtm: 8,
      rbpAtm: 14,
      growthAtRbpMm: null,
      balloons: steps(1.5, 4).map((d) => ({ diameterMm: d, inStock: true })),
    },
    {
      id: 3,
      name: "Illustrative NC without growth",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 18,
      growthAtRbpMm: null,
      balloons: steps(2, 5).map((d) => ({ diameterMm: d, inStock: true })),
    },
  ],
  stentPlatforms: [
    {
      id: 7,
      name: "Illustrative DES",
      sizes: [
        { nominalMm: 2.5, maxPostDilatationMm: 3.5 },
        { nominalMm: 2.75, maxPostDilatationMm: 3.5 },
        { nominalMm: 3, maxPostDilatationMm: 4.5 },
        { nominalMm: 3.5, maxPostDilatationMm: 4.5 },
        { nominalMm: 4, maxPostDilatationMm: 5 },
      ],
    },
  ],
};

const def = (over: Record<string, unknown> = {}, lookup: Record<string, unknown> = {}) =>
  chartDefinitionSchema.parse({
    title: "Illustrative chart",
    law: { law: "finet", ratio: 0.678 },
    lookups: [
      {
        kind: "proximal",
        rows: { from: 2.5, to: 4, step: 0.25 },
        cols: { from: 2, to: 3.5, step: 0.25 },
        rounding: "up",
        familyId: 1,
        ...lookup,
      },
    ],
    stentPlatformId: 7,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
    ...over,
  });
const snap = (d = def(), labIsDemo = false) =>
  buildSnapshot({ labName: "Illustrative lab", definition: d, stock, logoSha256: null, labIsDemo });
const cellOf = (d: ReturnType<typeof def>, row: number, col: number) => {
  const l = gridJson(snap(d)).lookups[0]!;
  return l.cells[l.rows.indexOf(row)]![l.cols.indexOf(col)]!;
};

describe("decimal labels: half away from zero on the decimal value", () => {
  it("prints 5.085 as 5.09 (binary 5.08499... would give 5.08)", () => {
    expect((5.085).toFixed(2)).toBe("5.08"); // the bug this function exists for
    expect(formatExactMm(5.085)).toBe("5.09");
    expect(formatExactMm(1.005)).toBe("1.01");
    expect(formatExactMm(-1.005)).toBe("-1.01");
    expect(formatSizeMm(3)).toBe("3.0");
    expect(formatSizeMm(2.75)).toBe("2.75");
    expect(formatDecimal(9.995, 2)).toBe("10.00");
  });

  it("agrees with decimal.js ROUND_HALF_UP (half away from zero) on decimals of up to 6 places", () => {
    const D = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });
    fc.assert(
      fc.property(
        fc.integer({ min: -99_999_999, max: 99_999_999 }),
        fc.integer({ min: 0, max: 6 }),
        fc.integer({ min: 0, max: 4 }),
        (units, scale, places) => {
          const text = new D(units).div(new D(10).pow(scale)).toFixed(scale);
          const expected = new D(text).toFixed(places, Decimal.ROUND_HALF_UP);
          const got = formatDecimal(Number(text), places);
          // decimal.js keeps a minus sign on a result that rounds to zero ("-0.00"); a label does not.
          expect(got).toBe(/^-0(\.0+)?$/.test(expected) ? expected.slice(1) : expected);
        },
      ),
      { numRuns: 3000 },
    );
  });
});

describe("stent limit at rated burst pressure, against every candidate stent", () => {
  it("a 3.5 mm NC balloon growing 0.2 mm reaches 3.7 mm at RBP: over a 2.5 or 2.75 mm stent (limit 3.5), marked", () => {
    // Growth at RBP as a compliance chart states it (common practice): 3.5 + 0.2 = 3.7 mm at 20 atm.
    // MB 2.5, SB 2.5: Finet 0.678 x 5 = 3.39 -> up to 3.5 at nominal; the 2.5 mm stent's limit is 3.5.
    const c = cellOf(def(), 2.5, 2.5);
    expect(c.sizeLabel).toBe("3.5");
    expect(c.marks).toContain("stent-limit");
  });

  it("MB 2.75, SB 2.0: rounded across the 3.25 gap to 3.5, 3.7 mm at RBP exceeds the 2.75 mm stent's 3.5", () => {
    // Finet 0.678 x (2.75 + 2.0) = 3.22 -> up to 3.5 (3.25 out of stock) -> 3.7 at RBP > 3.5: marked.
    expect(cellOf(def(), 2.75, 2)).toMatchObject({ sizeLabel: "3.5", marks: expect.arrayContaining(["stent-limit"]) });
  });

  it("a main branch between two nominals checks the smaller stent too (2.8 mm: 2.75 with limit 3.5)", () => {
    // MB 2.8 may get a 2.75 (limit 3.5) or a 3.0 (limit 4.5) stent (common practice).
    const grid = buildGrid({
      kind: "proximal",
      rows: [2.8],
      cols: [2.4],
      law: { law: "finet", ratio: 0.678 },
      rounding: "up",
      family: { ...toFamily(0), diameters: [3.5, 3.75, 4.0] },
      stent: stock.stentPlatforms[0]!.sizes,
    });
    // 0.678 x 5.2 = 3.53 -> 3.75, 3.95 at RBP: above the 2.75 mm stent's 3.5, within the 3.0's 4.5.
    const cell = grid.cells[0]![0]!;
    expect(cell.flags.hazard).toBe(true);
    expect(cell.hazardDetail).toContain("2.75 mm stent");
  });

  it("a family with no recorded growth is checked at nominal, and the subtitle says so", () => {
    const d = def({}, { familyId: 3 });
    const s = snap(d);
    expect(snapshotGrids(s)[0]!.stentCheck).toBe("nominal");
    expect(gridSubtitle(s.lookups[0]!, s.stent!.name)).toContain(
      "checked at nominal diameter (no growth at RBP recorded)",
    );
    expect(gridSubtitle(snap().lookups[0]!, "Illustrative DES")).toContain("checked at RBP");
    // 3.5 at nominal equals the 2.5 mm stent's limit (3.5): not marked without growth.
    expect(cellOf(d, 2.5, 2.5).marks).not.toContain("stent-limit");
  });
});

describe("rounding cap (defaults 0.25 mm up, 0.5 mm down; common practice)", () => {
  it("3.25 out of stock: exact 3.05 prints 3.5 (+0.45 mm) with an oversize mark", () => {
    const c = cellOf(def(), 2.5, 2); // 0.678 x 4.5 = 3.051
    expect(c).toMatchObject({ exactLabel: "3.05", sizeLabel: "3.5" });
    expect(c.marks).toContain("oversize");
  });

  it("a lab's own cap moves the mark", () => {
    const loose = def({ roundingCaps: { upMm: 0.5, downMm: 0.5 } });
    expect(cellOf(loose, 2.5, 2).marks).not.toContain("oversize");
  });

  it("rounding down past the cap below is undersize", () => {
    const d = chartDefinitionSchema.parse({
      ...def(),
      law: { law: "huo-kassab" },
      lookups: [{ kind: "side", rows: [4.0], cols: [3.0], rounding: "down", familyId: 1 }],
      stentPlatformId: null,
      roundingCaps: { upMm: 0.25, downMm: 0.1 },
    });
    // Huo-Kassab: (4^(7/3) - 3^(7/3))^(3/7) = 2.94 -> down to 2.75 (3.0 is above): 0.19 below, past 0.1.
    const c = gridJson(snap(d)).lookups[0]!.cells[0]![0]!;
    expect(c).toMatchObject({ exactLabel: "2.94", sizeLabel: "2.75" });
    expect(c.marks).toContain("undersize");
  });

  it("the designer names the stock gap: stocking 3.25 mm NC removes the oversize cells it causes", () => {
    const gaps = stockGaps(snap(), stock);
    const gap = gaps.find((g) => g.diameterMm === 3.25);
    expect(gap).toBeDefined();
    expect(gap!.oversizeRemoved).toBeGreaterThan(0);
    expect(gap!.message).toMatch(/^Stocking 3\.25 mm NC \(Illustrative NC\) would remove \d+ oversize cells?/);
  });

  it("a PATCH that leaves fields out keeps the chart's stent platform, notes and caps", () => {
    // Before: partial() kept the defaults, so PATCH {title} reset stentPlatformId to null and
    // silently switched the stent-limit check off.
    expect(chartPatchSchema.parse({ title: "Renamed" })).toEqual({ title: "Renamed" });
    const merged = chartDefinitionSchema.parse({
      ...def({ notes: "n" }),
      ...chartPatchSchema.parse({ title: "Renamed" }),
    });
    expect(merged).toMatchObject({ stentPlatformId: 7, notes: "n", roundingCaps: { upMm: 0.25, downMm: 0.5 } });
    expect(chartPatchSchema.safeParse({ roundingCaps: { upMm: 2 } }).error?.issues[0]?.path).toEqual([
      "roundingCaps",
      "upMm",
    ]);
  });

  it("stored definitions without caps still parse, with the defaults", () => {
    const { roundingCaps, ...old } = def();
    expect(roundingCaps).toEqual({ upMm: 0.25, downMm: 0.5 });
    expect(chartDefinitionSchema.parse(old).roundingCaps).toEqual({ upMm: 0.25, downMm: 0.5 });
  });
});

describe("rules per lookup (common practice)", () => {
  const rule = (d: ReturnType<typeof def>) => chartRuleIssues(d, stock).map((i) => `${i.path.join(".")}: ${i.message}`);
  it("accepts the usual choices", () => {
    expect(rule(def())).toEqual([]);
    expect(rule(def({}, { rounding: "reach" }))).toEqual([]);
    expect(rule(def({}, { rounding: "nearest" }))).toEqual([]);
  });
  it("POT: non-compliant, and up, nearest or reach", () => {
    expect(rule(def({}, { familyId: 2 }))[0]).toMatch(/^lookups\.0\.familyId: Rule "proximal family"/);
    expect(rule(def({}, { rounding: "down" }))[0]).toMatch(/^lookups\.0\.rounding: Rule "proximal rounding"/);
  });
  it("side: down or nearest; main: nearest or down", () => {
    const side = (rounding: string) =>
      chartDefinitionSchema.parse({
        ...def(),
        lookups: [{ kind: "side", rows: [4], cols: [3], rounding, familyId: 2 }],
      });
    expect(rule(side("up"))[0]).toMatch(/Rule "side rounding"/);
    expect(rule(side("reach"))[0]).toMatch(/Rule "side rounding"/);
    expect(rule(side("down"))).toEqual([]);
    const main = chartDefinitionSchema.parse({
      ...def(),
      lookups: [{ kind: "main", rows: [4], cols: [2], rounding: "up", familyId: 2 }],
    });
    expect(rule(main)[0]).toMatch(/Rule "main rounding"/);
  });
  it("reach needs recorded growth, and is refused as a 400 naming the rule", () => {
    const d = def({}, { familyId: 3, rounding: "reach" });
    expect(rule(d)).toEqual([
      'lookups.0.rounding: Rule "reach needs growth": Illustrative NC without growth records no growth at rated burst pressure, so no pressure can be printed',
    ]);
    try {
      assertChartRules(d, stock);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(AppError);
      expect((e as AppError).status).toBe(400);
      expect((e as AppError).issues?.[0]?.path).toEqual(["lookups", 0, "rounding"]);
    }
  });
  it("reach never prints a pressure above the family's rated burst pressure", () => {
    const json = gridJson(snap(def({}, { rounding: "reach" })));
    const atms = json.lookups[0]!.cells.flat().flatMap((c) => (c.atm === null ? [] : [c.atm]));
    expect(atms.length).toBeGreaterThan(0);
    for (const atm of atms) expect(atm).toBeLessThanOrEqual(20);
  });
});

describe("law fit that informs (Huo et al. 2012, doi 10.4244/EIJV7I11A206)", () => {
  it("a square-law kissing chart on ordinary diameters is mostly outside the fit (Dsb/Dmb <= 0.25), and Huo-Kassab fits", () => {
    const d = chartDefinitionSchema.parse({
      ...def(),
      law: { law: "square" },
      lookups: [
        {
          kind: "side",
          rows: { from: 3, to: 4.5, step: 0.25 },
          cols: { from: 2.5, to: 4, step: 0.25 },
          rounding: "down",
          familyId: 1,
        },
      ],
      stentPlatformId: null,
    });
    const s = snap(d);
    const share = outsideFitShare(snapshotGrids(s)[0]!);
    expect(share).toBeGreaterThan(0.5);
    expect(gridJson(s).lookups[0]!.outsideFitShare).toBe(share);
    const [advice] = fitAdvice(s);
    expect(advice!.better?.law.law).toBe("huo-kassab");
    expect(advice!.better?.share).toBe(0); // the 7/3 law fitted every type measured
    expect(advice!.message).toMatch(/outside the published fit of Square/);
  });
  it("Huo-Kassab charts report 0 and no advice", () => {
    const s = snap(def({ law: { law: "huo-kassab" } }));
    expect(gridJson(s).lookups[0]!.outsideFitShare).toBe(0);
    expect(fitAdvice(s)).toEqual([]);
  });
});

describe("grid JSON", () => {
  it("answers exactly the documented keys and mark names", () => {
    const json = gridJson(snap());
    expect(Object.keys(json)).toEqual(["lookups"]);
    const l = json.lookups[0]!;
    expect(Object.keys(l)).toEqual(["kind", "rounding", "familyId", "rows", "cols", "outsideFitShare", "cells"]);
    expect(l).toMatchObject({ kind: "proximal", rounding: "up", familyId: 1 });
    expect(l.rows).toEqual(steps(2.5, 4)); // proximal rows: main branch
    expect(l.cols).toEqual(steps(2, 3.5)); // proximal cols: side branch
    for (const c of l.cells.flat()) {
      expect(Object.keys(c)).toEqual(["exactMm", "exactLabel", "sizeMm", "sizeLabel", "atm", "marks"]);
      for (const m of c.marks) expect(GRID_MARKS).toContain(m);
      if (c.marks.includes("not-bifurcation")) expect(c).toMatchObject({ exactMm: null, sizeMm: null });
    }
  });
});

describe("caution per lab", () => {
  it("carries the invented-data clause only on demo labs", () => {
    expect(snap(def(), true).caution).toContain(DEMO_CLAUSE);
    expect(snap(def(), false).caution).not.toContain("invented");
  });
});

function toFamily(i: number): BalloonFamilyStock {
  const f = stock.balloonFamilies[i]!;
  return { ...f, diameters: f.balloons.filter((b) => b.inStock).map((b) => b.diameterMm) };
}

describe("properties over random stock, platforms and charts", () => {
  const familyArb = fc
    .record({
      lo: fc.integer({ min: 6, max: 12 }),
      count: fc.integer({ min: 2, max: 14 }),
      holes: fc.array(fc.integer({ min: 0, max: 14 }), { maxLength: 4 }),
      growth: fc.option(fc.integer({ min: 1, max: 8 }), { nil: null }),
      rbp: fc.integer({ min: 14, max: 24 }),
    })
    .map(({ lo, count, holes, growth, rbp }): BalloonFamilyStock => {
      const all = Array.from({ length: count }, (_, k) => (lo + k) * 0.25);
      const diameters = all.filter((_, k) => !holes.includes(k) || k === 0);
      return {
        name: "P",
        compliance: "nc",
        nominalAtm: 10,
        rbpAtm: rbp,
        growthAtRbpMm: growth === null ? null : growth / 20,
        diameters,
      };
    });
  const platformArb = fc
    .uniqueArray(fc.integer({ min: 8, max: 18 }), { minLength: 1, maxLength: 6 })
    .chain((nominals) =>
      fc.tuple(
        ...nominals.map((n) =>
          fc
            .integer({ min: 0, max: 8 })
            .map((extra): StentSize => ({ nominalMm: n * 0.25, maxPostDilatationMm: n * 0.25 + extra * 0.25 })),
        ),
      ),
    );
  const axisArb = fc
    .uniqueArray(fc.integer({ min: 60, max: 450 }), { minLength: 1, maxLength: 6 })
    .map((xs) => xs.sort((a, b) => a - b).map((x) => x / 100));
  const lawArb = fc.constantFrom(
    { law: "finet" as const, ratio: 0.678 },
    { law: "murray" as const },
    { law: "huo-kassab" as const },
    { law: "square" as const },
  );

  /** Candidate stents written independently: nominals from the nearest at or below to the nearest at or above. */
  const independentLowestLimit = (mb: number, platform: readonly StentSize[]): number | null => {
    const nominals = [...new Set(platform.map((s) => s.nominalMm))].sort((a, b) => a - b);
    const above = nominals.find((n) => n >= mb - 0.01);
    if (above === undefined) return null;
    const below = [...nominals].reverse().find((n) => n <= mb + 0.01) ?? above;
    const limits = platform
      .filter((s) => s.nominalMm >= below && s.nominalMm <= above)
      .map((s) => s.maxPostDilatationMm);
    return Math.min(...limits);
  };

  it("no cell without stent-limit has a balloon whose diameter at RBP exceeds any candidate stent's limit", () => {
    fc.assert(
      fc.property(
        familyArb,
        platformArb,
        axisArb,
        axisArb,
        lawArb,
        fc.constantFrom("up", "nearest", "reach"),
        (family, platform, rows, cols, law, rounding) => {
          const grid = buildGrid({
            kind: "proximal",
            rows,
            cols,
            law,
            rounding: rounding as "up",
            family,
            stent: platform,
          });
          for (const cell of grid.cells.flat()) {
            if (!cell.balloon?.ok || cell.flags.hazard) continue;
            // Growth at RBP as the family's compliance chart states it (common practice).
            const atRbp = cell.balloon.diameterMm + (family.growthAtRbpMm ?? 0);
            const limit = independentLowestLimit(cell.row, platform);
            expect(limit, `MB ${cell.row}: no covering stent must be marked`).not.toBeNull();
            expect(atRbp, `MB ${cell.row} SB ${cell.col}`).toBeLessThanOrEqual(limit! + 0.01 + 1e-9);
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  it("no printed size is further from its target than the cap without the matching mark", () => {
    fc.assert(
      fc.property(
        familyArb,
        axisArb,
        axisArb,
        lawArb,
        fc.constantFrom("proximal", "side", "main"),
        fc.constantFrom("up", "down", "nearest", "reach"),
        fc.integer({ min: 0, max: 8 }),
        fc.integer({ min: 0, max: 8 }),
        (family, rows, cols, law, kind, rounding, up, down) => {
          const caps = { upMm: up / 16, downMm: down / 16 };
          const grid = buildGrid({ kind: kind as "side", rows, cols, law, rounding: rounding as "up", family, caps });
          for (const cell of grid.cells.flat()) {
            if (!cell.exact.ok || !cell.balloon?.ok) continue;
            const b = cell.balloon;
            const delivered = b.pressureAtm === null ? b.diameterMm : b.expectedMm;
            const off = delivered - cell.exact.diameterMm;
            if (off > caps.upMm + 1e-9) expect(cell.flags.oversize).toBe(true);
            if (-off > caps.downMm + 1e-9) expect(cell.flags.undersize).toBe(true);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
