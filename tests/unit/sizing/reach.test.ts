import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { gridJson } from "@/lib/charts/grid-model";
import { buildSnapshot, type LabStock } from "@/lib/charts/snapshot";
import { DEFAULT_LAB_RULES, type LabRules } from "@/lib/labs/rules";
import { legendEntries } from "@/lib/poster/marks";
import { pickBalloon, type BalloonFamilyStock } from "@/lib/sizing";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { murrayParent } from "@/tests/support/published-laws";

// Invented, illustrative family: growth such that 3.1 mm reaches 3.372 mm only at about 19 atm.
const family: BalloonFamilyStock = {
  name: "NC (illustrative)",
  compliance: "nc",
  nominalAtm: 10,
  rbpAtm: 19.5,
  growthAtRbpMm: 0.287,
  diameters: [3.1, 3.35],
};

/**
 * The reference choice, written from the trade's rule and the family's compliance line alone
 * (linear from nominal pressure to rated burst pressure; the lab's own compliance chart rules):
 * among the sizes that reach the target by rated burst pressure, the lowest whole-atm pressure.
 */
function referenceReach(target: number, f: BalloonFamilyStock): { size: number; atm: number | null } | null {
  const sizes = [...f.diameters].sort((a, b) => a - b);
  const match = sizes.find((d) => Math.abs(d - target) <= 0.01 + 1e-9);
  if (match !== undefined) return { size: match, atm: null };
  if (target < sizes[0]!) return null;
  let best: { size: number; atm: number } | null = null;
  for (const d of sizes) {
    if (d >= target) continue;
    const needed = f.nominalAtm + ((target - d) / f.growthAtRbpMm!) * (f.rbpAtm - f.nominalAtm);
    const atm = Math.ceil(needed - 1e-9);
    if (atm > f.rbpAtm) continue;
    // Equal whole-atm pressures: the larger balloon (the largest nominal at or below the target).
    if (!best || atm <= best.atm) best = { size: d, atm };
  }
  if (best) return best;
  const up = sizes.find((d) => d > target);
  return up === undefined ? null : { size: up, atm: null };
}

describe("reach picks the balloon that needs the lowest pressure (common practice)", () => {
  it("takes the larger balloon at the lower pressure (3.35 mm at 11 atm, not 3.1 mm at 19 atm)", () => {
    const pick = pickBalloon(3.372, family, "reach");
    expect(pick).toMatchObject({ ok: true, diameterMm: 3.35, pressureAtm: 11 });
    expect(referenceReach(3.372, family)).toEqual({ size: 3.35, atm: 11 });
  });

  it("equals the reference choice and never prints above rated burst pressure (property)", () => {
    const famArb = fc.record({
      nominalAtm: fc.integer({ min: 6, max: 14 }),
      span: fc.integer({ min: 4, max: 14 }).map((n) => n + (n % 3 === 0 ? 0.5 : 0)),
      growth: fc.integer({ min: 5, max: 60 }).map((n) => n / 100),
      sizes: fc
        .uniqueArray(fc.integer({ min: 40, max: 200 }), { minLength: 1, maxLength: 10 })
        .map((a) => a.map((q) => q / 40)),
    });
    fc.assert(
      fc.property(famArb, fc.integer({ min: 50, max: 520 }), (g, t) => {
        const f: BalloonFamilyStock = {
          name: "F",
          compliance: "nc",
          nominalAtm: g.nominalAtm,
          rbpAtm: g.nominalAtm + g.span,
          growthAtRbpMm: g.growth,
          diameters: g.sizes,
        };
        const target = t / 100;
        const pick = pickBalloon(target, f, "reach");
        const ref = referenceReach(target, f);
        if (ref === null) {
          expect(pick.ok).toBe(false);
          return;
        }
        expect(pick).toMatchObject({ ok: true, diameterMm: ref.size, pressureAtm: ref.atm });
        if (pick.ok && pick.pressureAtm !== null) expect(pick.pressureAtm).toBeLessThanOrEqual(f.rbpAtm);
      }),
      { numRuns: 400 },
    );
  }, 60_000);
});

describe("near-rbp: a reach pressure within the lab's headroom below rated burst pressure is marked", () => {
  const stock: LabStock = {
    balloonFamilies: [
      {
        id: 1,
        name: "NC (illustrative)",
        compliance: "nc",
        nominalAtm: 12,
        rbpAtm: 20,
        growthAtRbpMm: 0.3,
        balloons: [2.5, 3, 3.5, 4, 4.5].map((d) => ({ diameterMm: d, inStock: true })),
      },
    ],
    stentPlatforms: [],
  };
  const def = chartDefinitionSchema.parse({
    title: "Reach",
    law: { law: "murray" },
    lookups: [
      {
        kind: "proximal",
        rows: { from: 2.5, to: 4, step: 0.25 },
        cols: { from: 2, to: 3.5, step: 0.25 },
        rounding: "reach",
        familyId: 1,
      },
    ],
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
  });
  const withHeadroom = (h: number): LabRules => ({
    ...DEFAULT_LAB_RULES,
    lookups: { ...DEFAULT_LAB_RULES.lookups, proximal: { ...DEFAULT_LAB_RULES.lookups.proximal, rbpHeadroomAtm: h } },
  });

  for (const headroom of [1, 2.5]) {
    it(`marks exactly the cells whose pressure is within ${headroom} atm of 20 atm; cells equal the reference (Murray, PNAS 1926)`, () => {
      const snap = buildSnapshot({
        labName: "Lab",
        definition: def,
        stock,
        logoSha256: null,
        labLimits: withHeadroom(headroom).lookups,
      });
      const json = gridJson(snap).lookups[0]!;
      let marked = 0;
      json.rows.forEach((mb, r) =>
        json.cols.forEach((sb, c) => {
          const cell = json.cells[r]![c]!;
          if (cell.exactMm === null) return;
          const ref = referenceReach(murrayParent(mb, sb), {
            ...snap.lookups[0]!.family!,
            diameters: [2.5, 3, 3.5, 4, 4.5],
          });
          expect(ref === null ? null : { size: ref.size, atm: ref.atm }).toEqual(
            cell.sizeMm === null ? null : { size: cell.sizeMm, atm: cell.atm },
          );
          const near = cell.atm !== null && 20 - cell.atm <= headroom;
          expect(cell.marks.includes("near-rbp"), JSON.stringify(cell)).toBe(near);
          if (near) marked++;
        }),
      );
      expect(marked).toBeGreaterThan(0);
    });
  }

  it("the legend explains the mark with the lab's headroom", () => {
    const e = legendEntries({
      law: { law: "murray" },
      stentName: null,
      hasProximal: true,
      hasReach: true,
      headroomAtm: 1.5,
    });
    expect(e.find((x) => x.mark === "nearRbp")!.text).toContain("within 1.5 atm of the balloon's rated burst pressure");
  });
});
