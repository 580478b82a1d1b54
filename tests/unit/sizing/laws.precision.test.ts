import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import { solve, type LawSpec } from "@/lib/sizing/laws";

// Independent reference: each law's published relation evaluated at 40 significant digits.
const D = Decimal.clone({ precision: 40 });
type Dec = InstanceType<typeof D>;

const SPECS: { spec: LawSpec; n: Dec | null; ratio: Dec | null; source: string }[] = [
  { spec: { law: "finet", ratio: 0.678 }, n: null, ratio: new D("0.678"), source: "Finet 2008" },
  {
    spec: { law: "finet", ratio: 0.72 },
    n: null,
    ratio: new D("0.72"),
    source: "Finet form, ratio 0.72",
  },
  { spec: { law: "murray" }, n: new D(3), ratio: null, source: "Murray 1926" },
  { spec: { law: "huo-kassab" }, n: new D(7).div(3), ratio: null, source: "Huo & Kassab 2009" },
  { spec: { law: "square" }, n: new D(2), ratio: null, source: "area-preserving" },
  { spec: { law: "power", n: 1.5 }, n: new D("1.5"), ratio: null, source: "power n 1.5" },
  { spec: { law: "power", n: 2.15 }, n: new D("2.15"), ratio: null, source: "power n 2.15" },
  { spec: { law: "power", n: 2.38 }, n: new D("2.38"), ratio: null, source: "power n 2.38" },
  { spec: { law: "power", n: 3.5 }, n: new D("3.5"), ratio: null, source: "power n 3.5" },
];

type Ref = { value: Dec; isSize: boolean };

function reference(law: (typeof SPECS)[number], known: { parent?: number; mb?: number; sb?: number }): Ref {
  const p = known.parent === undefined ? null : new D(known.parent);
  const m = known.mb === undefined ? null : new D(known.mb);
  const s = known.sb === undefined ? null : new D(known.sb);
  let P: Dec, M: Dec, S: Dec, value: Dec;
  if (law.ratio) {
    const r = law.ratio;
    if (p === null) value = P = r.mul(m!.add(s!));
    else if (s === null) value = S = p.div(r).sub(m!);
    else value = M = p.div(r).sub(s);
  } else {
    const n = law.n!;
    const pow = (x: Dec) => D.pow(x, n);
    const root = (x: Dec) => (x.lte(0) ? new D(-1) : D.pow(x, new D(1).div(n)));
    if (p === null) value = P = root(pow(m!).add(pow(s!)));
    else if (s === null) value = S = root(pow(p).sub(pow(m!)));
    else value = M = root(pow(p).sub(pow(s)));
  }
  P = p ?? value;
  M = m ?? value;
  S = s ?? value;
  // The meaningful geometry (common practice): a parent at least 0.05 mm above the main branch,
  // and the solved diameter within 0.5..10 mm.
  const meaningful = P.sub(M).gte("0.05") && value.gte("0.5") && value.lte(10);
  return { value, isSize: P.gt(M) && M.gte(S) && S.gt(0) && meaningful };
}

// Inputs on the 0.01 mm grid, built from integers so the cases are exact decimals.
const FACTORS_SB_OF_MB = [50, 62, 75, 88, 100];
const FACTORS_P_OF_MB = [105, 110, 115, 120, 130, 140];
const FACTORS_SB_OF_P = [50, 55, 60, 65, 70, 75];
const cases = {
  parent: Array.from({ length: 32 }, (_, i) => {
    const mbH = 150 + 15 * i;
    const sbH = Math.round((mbH * (FACTORS_SB_OF_MB[i % 5] as number)) / 100);
    return { mb: mbH / 100, sb: sbH / 100 };
  }),
  sb: Array.from({ length: 36 }, (_, i) => {
    const mbH = 150 + 12 * i;
    const pH = Math.round((mbH * (FACTORS_P_OF_MB[i % 6] as number)) / 100);
    return { parent: pH / 100, mb: mbH / 100 };
  }),
  mb: Array.from({ length: 36 }, (_, i) => {
    const pH = 200 + 15 * i;
    const sbH = Math.round((pH * (FACTORS_SB_OF_P[i % 6] as number)) / 100);
    return { parent: pH / 100, sb: sbH / 100 };
  }),
};

describe.each(SPECS)("$source agrees with a 40-digit evaluation", (law) => {
  for (const [direction, list] of Object.entries(cases)) {
    it(`solving ${direction}: sizes within 1e-12 relative, no size exactly where the reference has none`, () => {
      let sized = 0;
      for (const known of list) {
        const ref = reference(law, known);
        const got = solve(law.spec, known);
        expect(got.ok, JSON.stringify(known)).toBe(ref.isSize);
        if (got.ok) {
          sized++;
          const rel = new D(got.diameterMm).sub(ref.value).abs().div(ref.value).toNumber();
          expect(rel, JSON.stringify(known)).toBeLessThanOrEqual(1e-12);
        }
      }
      if (direction === "parent") expect(sized).toBeGreaterThanOrEqual(30);
      else expect(sized).toBeGreaterThanOrEqual(10);
    });
  }
});
