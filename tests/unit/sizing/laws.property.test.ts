import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { solve, type KnownDiameters, type LawSpec } from "@/lib/sizing/laws";

const RUNS = { numRuns: 500 };

const diameter = fc.double({ min: 0.5, max: 10, noNaN: true, noDefaultInfinity: true });
const anyDiameter = fc.double({ min: 0.01, max: 20, noNaN: true, noDefaultInfinity: true });
const powerSpec: fc.Arbitrary<LawSpec> = fc.oneof(
  fc.constant<LawSpec>({ law: "murray" }),
  fc.constant<LawSpec>({ law: "huo-kassab" }),
  fc.constant<LawSpec>({ law: "square" }),
  fc.double({ min: 1.5, max: 3.5, noNaN: true }).map((n): LawSpec => ({ law: "power", n })),
);
const finetSpec = fc.double({ min: 0.55, max: 0.8, noNaN: true }).map((ratio): LawSpec => ({ law: "finet", ratio }));
const anySpec = fc.oneof(powerSpec, finetSpec);

/** Branch pair ordered as the law expects: mb >= sb. */
const branches = fc.tuple(diameter, diameter).map(([a, b]) => ({ mb: Math.max(a, b), sb: Math.min(a, b) }));

/** The law's relation, written out independently of the implementation. */
function lawParent(spec: LawSpec, a: number, b: number): number {
  if (spec.law === "finet") return spec.ratio * (a + b);
  const n = spec.law === "power" ? spec.n : { murray: 3, "huo-kassab": 7 / 3, square: 2 }[spec.law];
  return Math.pow(Math.pow(a, n) + Math.pow(b, n), 1 / n);
}

describe("law properties", () => {
  it("the parent is the law's symmetric relation: the branches swapped give the same value", () => {
    fc.assert(
      fc.property(anySpec, branches, (spec, { mb, sb }) => {
        const r = solve(spec, { mb, sb });
        if (!r.ok) return;
        expect(Math.abs(r.diameterMm - lawParent(spec, sb, mb))).toBeLessThanOrEqual(1e-12 * r.diameterMm);
        if (sb < mb) expect(solve(spec, { mb: sb, sb: mb }).ok).toBe(false);
      }),
      RUNS,
    );
  });

  it("the parent increases with each branch", () => {
    const step = fc.double({ min: 1e-3, max: 2, noNaN: true });
    fc.assert(
      fc.property(anySpec, branches, step, (spec, { mb, sb }, d) => {
        const base = solve(spec, { mb, sb });
        if (!base.ok) return;
        const biggerMb = solve(spec, { mb: mb + d, sb });
        if (biggerMb.ok) expect(biggerMb.diameterMm).toBeGreaterThan(base.diameterMm);
        const sb2 = Math.min(sb + d, mb);
        if (sb2 - sb > 1e-6) {
          const biggerSb = solve(spec, { mb, sb: sb2 });
          // A larger side branch only moves the parent further from the main branch; it can
          // leave the meaningful range only above 10 mm.
          expect(biggerSb.ok || lawParent(spec, mb, sb2) > 10).toBe(true);
          if (biggerSb.ok) expect(biggerSb.diameterMm).toBeGreaterThan(base.diameterMm);
        }
      }),
      RUNS,
    );
  });

  it("solving a branch from the parent just computed gives the branch back", () => {
    fc.assert(
      fc.property(anySpec, branches, (spec, { mb, sb }) => {
        const p = solve(spec, { mb, sb });
        if (!p.ok) return;
        const sbBack = solve(spec, { parent: p.diameterMm, mb });
        const mbBack = solve(spec, { parent: p.diameterMm, sb });
        expect(sbBack.ok && Math.abs(sbBack.diameterMm - sb)).toBeLessThanOrEqual(1e-9);
        expect(mbBack.ok && Math.abs(mbBack.diameterMm - mb)).toBeLessThanOrEqual(1e-9);
      }),
      RUNS,
    );
  });

  it("for the same branches, parent(square) >= parent(Huo-Kassab) >= parent(Murray)", () => {
    fc.assert(
      fc.property(branches, ({ mb, sb }) => {
        const sq = solve({ law: "square" }, { mb, sb });
        const hk = solve({ law: "huo-kassab" }, { mb, sb });
        const mu = solve({ law: "murray" }, { mb, sb });
        // Power laws size ordered branches unless the parent lands less than 0.05 mm above the
        // main branch or above 10 mm (the meaningful geometry); the ordering holds where all size.
        if (!(sq.ok && hk.ok && mu.ok)) {
          expect(lawParent({ law: "square" }, mb, sb) > 10 || lawParent({ law: "murray" }, mb, sb) - mb < 0.05).toBe(
            true,
          );
          return;
        }
        expect(sq.diameterMm).toBeGreaterThanOrEqual(hk.diameterMm);
        expect(hk.diameterMm).toBeGreaterThanOrEqual(mu.diameterMm);
      }),
      RUNS,
    );
  });

  it("never returns a number that breaks parent > mb >= sb > 0", () => {
    const knownArb = fc
      .tuple(fc.constantFrom("parent", "mb", "sb"), anyDiameter, anyDiameter)
      .map(([unknown, x, y]): KnownDiameters => {
        if (unknown === "parent") return { mb: x, sb: y };
        if (unknown === "mb") return { parent: x, sb: y };
        return { parent: x, mb: y };
      });
    fc.assert(
      fc.property(anySpec, knownArb, (spec, known) => {
        const r = solve(spec, known);
        if (!r.ok) {
          expect(r.reason.length).toBeGreaterThan(10);
          expect(r).not.toHaveProperty("diameterMm");
          return;
        }
        const t = { ...known, [r.solved]: r.diameterMm } as Required<KnownDiameters>;
        expect(Number.isFinite(r.diameterMm)).toBe(true);
        expect(t.parent).toBeGreaterThan(t.mb);
        expect(t.mb).toBeGreaterThanOrEqual(t.sb);
        expect(t.sb).toBeGreaterThan(0);
        // The meaningful geometry: 0.5..10 mm, parent at least 0.05 mm above the main branch.
        for (const v of [t.parent, t.mb, t.sb]) {
          expect(v).toBeGreaterThanOrEqual(0.5 - 1e-9);
          expect(v).toBeLessThanOrEqual(10 + 1e-9);
        }
        expect(t.parent - t.mb).toBeGreaterThanOrEqual(0.05 - 1e-9);
      }),
      { numRuns: 2000 },
    );
  });

  it("Finet sizes a parent exactly when the side branch exceeds (1 − r)/r of the main branch", () => {
    fc.assert(
      fc.property(finetSpec, branches, (spec, { mb, sb }) => {
        if (spec.law !== "finet") return;
        const threshold = (1 - spec.ratio) / spec.ratio;
        const q = sb / mb;
        fc.pre(Math.abs(q - threshold) > 1e-6);
        const parent = spec.ratio * (mb + sb);
        fc.pre(Math.abs(parent - mb - 0.05) > 1e-6 && Math.abs(parent - 10) > 1e-6);
        const r = solve(spec, { mb, sb });
        // Finet's threshold, then the meaningful geometry (parent >= mb + 0.05 mm, <= 10 mm).
        expect(r.ok).toBe(q > threshold && parent - mb >= 0.05 && parent <= 10);
        if (!r.ok && q <= threshold) expect(r.reason).toContain(threshold.toFixed(3));
      }),
      RUNS,
    );
  });
});
