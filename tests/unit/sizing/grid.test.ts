import { describe, expect, it } from "vitest";
import {
  GridInputError,
  buildGrid,
  gridSummary,
  pickBalloon,
  solve,
  type BalloonFamilyStock,
  type Cell,
  type Grid,
  type LawSpec,
  type StentSize,
} from "@/lib/sizing";

// Illustrative stock and platform, invented for tests.
const family: BalloonFamilyStock = {
  name: "Illustrative NC family",
  compliance: "nc",
  nominalAtm: 12,
  rbpAtm: 20,
  growthAtRbpMm: 0.25,
  diameters: [2.0, 2.5, 3.0, 3.5, 4.0, 4.5],
};
const platform: StentSize[] = [
  { nominalMm: 3.0, maxPostDilatationMm: 3.75 },
  { nominalMm: 3.5, maxPostDilatationMm: 4.5 },
];
const finet: LawSpec = { law: "finet", ratio: 0.678 };

function cell(grid: Grid, row: number, col: number): Cell {
  const c = grid.cells.flat().find((x) => x.row === row && x.col === col);
  if (!c) throw new Error(`no cell ${row} x ${col}`);
  return c;
}

describe("proximal lookup (POT from MB x SB), Finet 0.678, round up", () => {
  const grid = buildGrid({
    kind: "proximal",
    rows: [3.0, 3.5],
    cols: [1.0, 2.0, 2.5, 3.0, 3.5],
    law: finet,
    rounding: "up",
    family,
    stent: platform,
  });

  it("has the shape and vessels of the lookup", () => {
    expect(grid.solved).toBe("parent");
    expect(grid.rowAxis).toMatchObject({ vessel: "mb", values: [3.0, 3.5] });
    expect(grid.colAxis).toMatchObject({ vessel: "sb", values: [1.0, 2.0, 2.5, 3.0, 3.5] });
    expect(grid.rowAxis.label).toMatch(/main branch/i);
    expect(grid.cells).toHaveLength(2);
    for (const row of grid.cells) expect(row).toHaveLength(5);
    expect(grid.cells[1]?.[2]).toMatchObject({ row: 3.5, col: 2.5 });
  });

  it("sizes cells by hand: 0.678 × (Dmb + Dsb), then the next stocked size up", () => {
    const expected: [number, number, number, number][] = [
      [3.0, 2.0, 3.39, 3.5],
      [3.0, 2.5, 3.729, 4.0],
      [3.0, 3.0, 4.068, 4.5],
      [3.5, 2.0, 3.729, 4.0],
      [3.5, 2.5, 4.068, 4.5],
      [3.5, 3.0, 4.407, 4.5],
    ];
    for (const [mb, sb, exact, balloon] of expected) {
      const c = cell(grid, mb, sb);
      expect(c.exact.ok && c.exact.diameterMm).toBeCloseTo(exact, 12);
      expect(c.balloon).toMatchObject({ ok: true, diameterMm: balloon, pressureAtm: null });
    }
  });

  it("impossible cells carry a reason and no number", () => {
    for (const [mb, sb] of [
      [3.0, 1.0], // 0.678 × 4 = 2.712 < 3.0
      [3.5, 1.0], // 0.678 × 4.5 = 3.051 < 3.5
      [3.0, 3.5], // side branch above main branch
    ] as const) {
      const c = cell(grid, mb, sb);
      expect(c.exact.ok).toBe(false);
      expect(c.exact).not.toHaveProperty("diameterMm");
      expect(c.exact.ok === false && c.exact.reason.length).toBeGreaterThan(10);
      expect(c.balloon).toBeNull();
      expect(c.flags).toEqual({ hazard: false, outsideFit: false, oversize: false, undersize: false });
    }
  });

  it("a size above the stock says so", () => {
    // 0.678 × 7 = 4.746 > 4.5, the largest stocked size.
    expect(cell(grid, 3.5, 3.5).balloon).toMatchObject({ ok: false, code: "above_stock" });
  });

  it("flags a POT balloon above the main-branch stent's post-dilatation limit", () => {
    // Checked at rated burst pressure: nominal + 0.25 mm growth (the illustrative family's
    // compliance chart, read as a manufacturer's chart states it; common practice).
    expect(cell(grid, 3.0, 2.0).flags.hazard).toBe(false); // 3.5 -> 3.75 at RBP <= 3.75
    expect(cell(grid, 3.0, 2.5).flags.hazard).toBe(true); // 4.0 -> 4.25 > 3.75
    expect(cell(grid, 3.0, 2.5).hazardDetail).toBe(
      "POT 4.25 mm at RBP 20 atm exceeds the 3.00 mm stent's maximum post-dilatation diameter (3.75 mm)",
    );
    expect(cell(grid, 3.0, 3.0).flags.hazard).toBe(true); // 4.5 -> 4.75 > 3.75
    expect(cell(grid, 3.5, 2.0).flags.hazard).toBe(false); // 4.0 -> 4.25 <= 4.5
    expect(cell(grid, 3.5, 2.5).flags.hazard).toBe(true); // 4.5 at nominal is 4.5, but 4.75 at RBP > 4.5
    expect(cell(grid, 3.5, 3.5).flags.hazard).toBe(true); // no balloon: exact 4.746 > 4.5
  });

  it("flags cells outside Finet's published fit (Dsb/Dmb < 0.75)", () => {
    expect(cell(grid, 3.0, 2.0).flags.outsideFit).toBe(true); // 0.667
    expect(cell(grid, 3.0, 2.0).fitNote).toContain("near-symmetric");
    expect(cell(grid, 3.0, 2.5).flags.outsideFit).toBe(false); // 0.833
    expect(cell(grid, 3.5, 2.5).flags.outsideFit).toBe(true); // 0.714
  });

  it("counts cells for the legend", () => {
    expect(gridSummary(grid)).toEqual({
      cells: 10,
      sized: 6,
      noSize: 3,
      noStock: 1,
      hazard: 5, // 3.0 x 2.5, 3.0 x 3.0, 3.5 x 2.5, 3.5 x 3.0 (at RBP), 3.5 x 3.5 (no stock)
      outsideFit: 3,
      // Beyond the default 0.25 mm cap above (stock in 0.5 mm steps): 4.0 for 3.729 (twice), 4.5 for 4.068 (twice).
      oversize: 4,
      undersize: 0,
      nearRbp: 0,
    });
  });
});

describe("hazard with reach-by-pressure uses the diameter reached", () => {
  it("3.5 at 20 atm reaches 3.75 mm, above a 3.6 mm limit though 3.5 is not", () => {
    // Finet 0.678 × (3.0 + 2.5) = 3.729: 3.5 needs 12 + 8 × 0.229/0.25 = 19.3 -> 20 atm.
    const grid = buildGrid({
      kind: "proximal",
      rows: [3.0],
      cols: [2.5],
      law: finet,
      rounding: "reach",
      family,
      stent: [{ nominalMm: 3.0, maxPostDilatationMm: 3.6 }],
    });
    const c = cell(grid, 3.0, 2.5);
    expect(c.balloon).toMatchObject({ ok: true, diameterMm: 3.5, pressureAtm: 20 });
    expect(c.flags.hazard).toBe(true);
  });
});

describe("side and main lookups", () => {
  const murray: LawSpec = { law: "murray" };

  it("side: rows parent, cols main branch, solves the side branch; equals solve + pickBalloon", () => {
    const grid = buildGrid({
      kind: "side",
      rows: { from: 4, to: 5, step: 0.5 },
      cols: { from: 3, to: 4.5, step: 0.5 },
      law: murray,
      rounding: "down",
      family,
      stent: platform,
    });
    expect(grid.solved).toBe("sb");
    expect(grid.rowAxis.vessel).toBe("parent");
    expect(grid.colAxis.vessel).toBe("mb");
    // Murray: (125 − 64)^(1/3) = 3.9365, rounded down to 3.5.
    const c = cell(grid, 5, 4);
    expect(c.exact.ok && c.exact.diameterMm).toBeCloseTo(3.936497183102173, 12);
    expect(c.balloon).toMatchObject({ ok: true, diameterMm: 3.5 });
    for (const x of grid.cells.flat()) {
      const direct = solve(murray, { parent: x.row, mb: x.col });
      expect(x.exact.ok).toBe(direct.ok);
      if (direct.ok && x.exact.ok) {
        expect(x.exact.diameterMm).toBe(direct.diameterMm);
        expect(x.balloon).toEqual(pickBalloon(direct.diameterMm, family, "down"));
      }
      expect(x.flags.hazard).toBe(false); // no stent check outside proximal lookups
    }
    // Parent 4 with main branch 4 or 4.5: no side branch.
    expect(cell(grid, 4, 4.5).exact.ok).toBe(false);
  });

  it("main: rows parent, cols side branch, solves the main branch", () => {
    const grid = buildGrid({
      kind: "main",
      rows: [4, 5],
      cols: [2.5, 3],
      law: { law: "square" },
      rounding: "nearest",
      family: null,
    });
    expect(grid.solved).toBe("mb");
    expect(grid.rowAxis.vessel).toBe("parent");
    expect(grid.colAxis.vessel).toBe("sb");
    expect(cell(grid, 5, 3).exact).toEqual({ ok: true, diameterMm: 4 }); // √(25 − 9)
    for (const x of grid.cells.flat()) expect(x.balloon).toBeNull();
    // Parent 4, sb 3: √7 = 2.646 < 3, so no main branch.
    expect(cell(grid, 4, 3).exact.ok).toBe(false);
  });

  it("Murray fit marks all but very asymmetric cells", () => {
    const grid = buildGrid({
      kind: "proximal",
      rows: [4],
      cols: [0.5, 1, 1.5],
      law: murray,
      rounding: "up",
      family,
    });
    expect(grid.cells[0]?.map((c) => c.flags.outsideFit)).toEqual([false, false, true]);
  });
});

describe("invalid grid input", () => {
  it("throws GridInputError for bad axes or law bounds", () => {
    const base = {
      kind: "proximal",
      rows: [3],
      cols: [2],
      law: finet,
      rounding: "up",
      family,
    } as const;
    expect(() => buildGrid({ ...base, rows: [3, 2] })).toThrow(GridInputError);
    expect(() => buildGrid({ ...base, cols: { from: 1, to: 2, step: 0.3 } })).toThrow(/Columns/);
    expect(() => buildGrid({ ...base, law: { law: "finet", ratio: 0.9 } })).toThrow(GridInputError);
  });
});
