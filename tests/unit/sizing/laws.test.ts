import { describe, expect, it } from "vitest";
import {
  figureAgainst,
  lawCitation,
  FINET_DEFAULT_RATIO,
  FINET_RATIO_MAX,
  FINET_RATIO_MIN,
  HUO_KASSAB_N,
  LAWS,
  MURRAY_N,
  POWER_N_MAX,
  POWER_N_MIN,
  SQUARE_N,
  lawFormula,
  lawName,
  lawSpecProblem,
  solve,
  type LawSpec,
  type SolveResult,
} from "@/lib/sizing/laws";

const finet: LawSpec = { law: "finet", ratio: 0.678 };
const murray: LawSpec = { law: "murray" };
const huo: LawSpec = { law: "huo-kassab" };
const square: LawSpec = { law: "square" };

function value(r: SolveResult): number {
  if (!r.ok) throw new Error(`expected a size, got: ${r.reason}`);
  return r.diameterMm;
}
function reason(r: SolveResult): string {
  if (r.ok) throw new Error(`expected no size, got ${r.diameterMm}`);
  return r.reason;
}

describe("law constants and metadata", () => {
  it("has the published constants and the product's bounds", () => {
    expect(FINET_DEFAULT_RATIO).toBe(0.678);
    expect([FINET_RATIO_MIN, FINET_RATIO_MAX]).toEqual([0.55, 0.8]);
    expect([POWER_N_MIN, POWER_N_MAX]).toEqual([1.5, 3.5]);
    expect(MURRAY_N).toBe(3);
    expect(HUO_KASSAB_N).toBeCloseTo(2.333333333333, 12);
    expect(SQUARE_N).toBe(2);
  });

  it("names each law and cites its source", () => {
    expect(Object.values(LAWS).map((l) => l.name)).toEqual([
      "Finet",
      "Murray",
      "Huo-Kassab",
      "Square (area-preserving)",
      "Power",
    ]);
    // Verified against the journal's article page: title, authors, journal and year; the volume and
    // pages (2008;3:490-498, from memory) are not, so the printed citation leaves them out.
    expect(LAWS.finet.source).toBe(
      "Finet G, Gilard M, Perrenot B, et al. Fractal geometry of arterial coronary bifurcations: a QCA and IVUS analysis. EuroIntervention (2008)",
    );
    for (const law of Object.values(LAWS)) expect(law.source).not.toMatch(/from memory/i);
    expect(LAWS.murray.source).toContain("PNAS 1926");
    expect(LAWS["huo-kassab"].source).toContain("Biophys J 2009");
    expect(LAWS.square.source).toContain("10.4244/EIJV7I11A206");
    expect(LAWS.power.source).toContain("10.3389/fphys.2022.871912");
  });

  it("writes each formula with the spec's own constant", () => {
    expect(lawFormula(finet)).toBe("Dp = 0.678 × (Dmb + Dsb)");
    expect(lawFormula({ law: "finet", ratio: 0.7 })).toBe("Dp = 0.7 × (Dmb + Dsb)");
    expect(lawFormula(murray)).toBe("Dp³ = Dmb³ + Dsb³");
    expect(lawFormula(huo)).toBe("Dp^(7/3) = Dmb^(7/3) + Dsb^(7/3)");
    expect(lawFormula(square)).toBe("Dp² = Dmb² + Dsb²");
    expect(lawFormula({ law: "power", n: 2.3 })).toBe("Dp^2.3 = Dmb^2.3 + Dsb^2.3");
    expect(lawName({ law: "power", n: 0.1 + 2.2 })).toBe("Power (n = 2.3)");
  });

  it("rejects specs outside the bounds", () => {
    expect(lawSpecProblem({ law: "finet", ratio: 0.55 })).toBeNull();
    expect(lawSpecProblem({ law: "finet", ratio: 0.81 })).toMatch(/between 0.55 and 0.8/);
    expect(lawSpecProblem({ law: "power", n: 1.49 })).toMatch(/between 1.5 and 3.5/);
    expect(lawSpecProblem({ law: "power", n: Number.NaN })).not.toBeNull();
    expect(() => solve({ law: "power", n: 4 }, { mb: 3, sb: 2 })).toThrow(RangeError);
  });
});

describe("hand-computed values", () => {
  // Finet G et al., EuroIntervention 2008: Dp = 0.678 (Dmb + Dsb).
  it("Finet: parent, side and main branch", () => {
    expect(value(solve(finet, { mb: 3.5, sb: 2.5 }))).toBeCloseTo(4.068, 12); // 0.678 × 6
    expect(value(solve(finet, { mb: 3, sb: 2 }))).toBeCloseTo(3.39, 12); // 0.678 × 5
    expect(value(solve(finet, { parent: 4.068, mb: 3.5 }))).toBeCloseTo(2.5, 12); // 4.068/0.678 − 3.5
    expect(value(solve(finet, { parent: 4.068, sb: 2.5 }))).toBeCloseTo(3.5, 12);
    expect(value(solve(finet, { parent: 4, mb: 3 }))).toBeCloseTo(2.899705014749263, 12); // 4/0.678 − 3
    expect(value(solve({ law: "finet", ratio: 0.7 }, { mb: 3, sb: 2 }))).toBeCloseTo(3.5, 12); // 0.7 × 5
  });

  // Murray CD, PNAS 1926: Dp³ = Dmb³ + Dsb³.
  it("Murray: cube law", () => {
    expect(value(solve(murray, { mb: 3, sb: 3 }))).toBeCloseTo(3.779763149684619, 12); // 3 × 2^(1/3)
    expect(value(solve(murray, { mb: 4, sb: 3 }))).toBeCloseTo(4.497941445275415, 12); // 91^(1/3)
    expect(value(solve(murray, { parent: 5, mb: 4 }))).toBeCloseTo(3.936497183102173, 12); // 61^(1/3)
    expect(value(solve(murray, { parent: 5, sb: 3 }))).toBeCloseTo(4.610436292058447, 12); // 98^(1/3)
  });

  // Huo Y, Kassab GS, Biophys J 2009: Dp^(7/3) = Dmb^(7/3) + Dsb^(7/3).
  it("Huo-Kassab: 7/3 law", () => {
    expect(value(solve(huo, { mb: 3, sb: 2 }))).toBeCloseTo(3.452867421785996, 12);
    expect(value(solve(huo, { mb: 3.5, sb: 2.5 }))).toBeCloseTo(4.111532326796182, 12);
    expect(value(solve(huo, { mb: 3, sb: 3 }))).toBeCloseTo(4.037700577897068, 12); // 3 × 2^(3/7)
    expect(value(solve(huo, { parent: 4, mb: 3 }))).toBeCloseTo(2.943620639867697, 12);
    expect(value(solve(huo, { parent: 4, sb: 2.5 }))).toBeCloseTo(3.360560892227402, 12);
  });

  // Area-preserving square law as compared in Huo et al., EuroIntervention 2012.
  it("square: Pythagorean triples", () => {
    expect(value(solve(square, { mb: 4, sb: 3 }))).toBeCloseTo(5, 12);
    expect(value(solve(square, { parent: 5, mb: 4 }))).toBeCloseTo(3, 12);
    expect(value(solve(square, { parent: 2.6, mb: 2.4 }))).toBeCloseTo(1, 12); // 6.76 − 5.76
    expect(value(solve(square, { parent: 2.6, sb: 1 }))).toBeCloseTo(2.4, 12);
    expect(value(solve(square, { mb: 3, sb: 3 }))).toBeCloseTo(4.242640687119285, 12); // 3√2
  });

  it("power: n chosen by the lab", () => {
    expect(value(solve({ law: "power", n: 2.5 }, { mb: 3, sb: 2 }))).toBeCloseTo(3.395511779189871, 12);
    expect(value(solve({ law: "power", n: 3 }, { mb: 4, sb: 3 }))).toBeCloseTo(4.497941445275415, 12);
    expect(value(solve({ law: "power", n: 2 }, { parent: 5, mb: 4 }))).toBeCloseTo(3, 12);
  });

  it("accepts equal branches and keeps a solved side branch at or below the main branch", () => {
    const p = 3 * Math.SQRT2;
    const sb = value(solve(square, { parent: p, mb: 3 }));
    expect(sb).toBeCloseTo(3, 9);
    expect(sb).toBeLessThanOrEqual(3);
    const mb = value(solve(square, { parent: p, sb: 3 }));
    expect(mb).toBeGreaterThanOrEqual(3);
  });
});

describe("no size for impossible geometry", () => {
  it("Finet parent below the main branch when the side branch is under (1 − r)/r of it", () => {
    // (1 − 0.678)/0.678 = 0.47493: sb/mb 0.45 fails, 0.475 passes (0.678 × 5.9 = 4.0002).
    const r = solve(finet, { mb: 4, sb: 1.8 });
    expect(reason(r)).toBe(
      "Finet (ratio 0.678) gives a parent no larger than the main branch when the side branch is 0.475 of the main branch or less (here 0.450)",
    );
    // 0.678 × 5.9 = 4.0002 is above the main branch but by less than 0.05 mm: not a bifurcation.
    expect(reason(solve(finet, { mb: 4, sb: 1.9 }))).toContain("Not a bifurcation");
    expect(value(solve(finet, { mb: 4, sb: 2 }))).toBeCloseTo(4.068, 12);
    // With ratio 0.6 the threshold is 0.4/0.6 = 0.667.
    expect(reason(solve({ law: "finet", ratio: 0.6 }, { mb: 3, sb: 1.95 }))).toContain("0.667");
  });

  it("Finet exactly at the threshold is no size (0.678 × (3.39 + 1.61) = 3.39)", () => {
    expect(solve(finet, { mb: 3.39, sb: 1.61 }).ok).toBe(false);
  });

  it("a side branch larger than the main branch is no size", () => {
    for (const spec of [finet, murray, huo, square]) {
      expect(reason(solve(spec, { mb: 2.5, sb: 3 }))).toBe("The side branch cannot be larger than the main branch");
    }
  });

  it("a main branch at or above the parent leaves no side branch", () => {
    for (const known of [
      { parent: 3, mb: 3 },
      { parent: 3, mb: 3.5 },
    ]) {
      expect(reason(solve(murray, known))).toBe(
        "With the main branch at or above the parent, no side branch fits this law",
      );
      expect(solve(finet, known).ok).toBe(false);
    }
  });

  it("a side branch at or above the parent leaves no main branch", () => {
    expect(reason(solve(huo, { parent: 3, sb: 3 }))).toBe(
      "With the side branch at or above the parent, no main branch fits this law",
    );
  });

  it("a solved side branch larger than the main branch is no size", () => {
    // Murray: sb = 98^(1/3) = 4.61 > 3 since 5/3 > 2^(1/3) = 1.260.
    expect(reason(solve(murray, { parent: 5, mb: 3 }))).toBe(
      "Murray gives a side branch larger than the main branch when the parent is more than 1.260 times the main branch (here 1.667)",
    );
    // Finet: 4.1/3 = 1.367 > 2 × 0.678 = 1.356.
    expect(reason(solve(finet, { parent: 4.1, mb: 3 }))).toContain("more than 1.356 times");
  });

  it("a solved main branch smaller than the side branch is no size", () => {
    // Murray: mb = 15.875^(1/3) = 2.513 < 3 since 3.5/3 < 1.260.
    expect(reason(solve(murray, { parent: 3.5, sb: 3 }))).toContain(
      "main branch smaller than the side branch when the parent is under 1.260 times",
    );
    // Finet: mb = 4/0.678 − 3 = 2.8997 < 3; 3/4 = 0.75 > 1/(2 × 0.678) = 0.737.
    expect(reason(solve(finet, { parent: 4, sb: 3 }))).toContain("more than 0.737 of the parent");
  });

  it("a Finet main branch at or above the parent is no size", () => {
    // mb = 4/0.678 − 1.8 = 4.0997 ≥ 4; 1.8/4 = 0.45 ≤ 0.4749.
    expect(reason(solve(finet, { parent: 4, sb: 1.8 }))).toContain(
      "main branch at or above the parent when the side branch is 0.475 of the parent or less",
    );
    expect(value(solve(finet, { parent: 4, sb: 2.5 }))).toBeCloseTo(3.399705014749263, 12);
  });

  it("rejects zero, negative and non-finite inputs without a number", () => {
    expect(reason(solve(murray, { mb: 0, sb: 2 }))).toBe("Diameters must be greater than zero");
    expect(reason(solve(murray, { parent: -4, mb: 2 }))).toBe("Diameters must be greater than zero");
    expect(reason(solve(murray, { mb: Number.NaN, sb: 2 }))).toBe("Diameters must be numbers in mm");
    expect(solve(murray, { mb: Infinity, sb: 2 }).ok).toBe(false);
  });

  it("throws when not exactly two diameters are given", () => {
    expect(() => solve(murray, { mb: 3 })).toThrow(RangeError);
    expect(() => solve(murray, { parent: 4, mb: 3, sb: 2 })).toThrow(RangeError);
  });
});

describe("warnings", () => {
  it("carries the fit note when outside the published fit", () => {
    const r = solve(murray, { mb: 3, sb: 3 });
    expect(r.ok && r.warnings).toEqual([expect.stringContaining("very asymmetric")]);
    const h = solve(huo, { mb: 3, sb: 3 });
    expect(h.ok && h.warnings).toEqual([]);
  });
});

describe("the citation under a power-law chart", () => {
  // Taylor DJ et al., Front Physiol 2022, doi 10.3389/fphys.2022.871912: n of 2.15 to 2.38 fitted in human coronaries.
  it("states the exponent used and says plainly when it lies outside the cited study's fitted range", () => {
    expect(lawCitation({ law: "power", n: 1.6 })).toMatch(
      /^Power law with n = 1\.6, .*OUTSIDE the range n = 2\.15 to 2\.38/,
    );
    expect(lawCitation({ law: "power", n: 1.6 })).toContain("does not support this exponent");
    expect(lawCitation({ law: "power", n: 2.3 })).toContain(
      "n = 2.3, chosen by the lab; within the range n = 2.15 to 2.38",
    );
    expect(lawCitation({ law: "power", n: 2.38 })).toContain("within");
    expect(lawCitation({ law: "power", n: 2.4 })).toContain("OUTSIDE");
    expect(lawCitation({ law: "murray" })).toContain("Murray CD");
  });
});

describe("refusals show the figure that explains them", () => {
  it("parent=3.0499, mb=3: 0.0499 mm, not 0.050 mm, below the 0.05 mm step (common practice)", () => {
    const r = solve({ law: "murray" }, { parent: 3.0499, mb: 3 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toContain("(here 0.0499 mm)");
    expect(figureAgainst(0.0499, 0.05)).toBe("0.0499");
    expect(figureAgainst(0.04999, 0.05)).toBe("0.04999");
    expect(figureAgainst(0.043, 0.05)).toBe("0.043");
    expect(figureAgainst(10.0004, 10)).toBe("10.0004");
  });
});
