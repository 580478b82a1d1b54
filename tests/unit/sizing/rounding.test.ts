import { describe, expect, it } from "vitest";
import {
  DEFAULT_ROUNDING,
  STOCK_TOLERANCE_MM,
  balloonDiameterAt,
  pickBalloon,
  type BalloonFamilyStock,
  type BalloonPick,
} from "@/lib/sizing/rounding";

// Illustrative stock, invented for tests: 2.75 and 3.25 are out of stock, so not listed.
const nc: BalloonFamilyStock = {
  name: "Illustrative NC family",
  compliance: "nc",
  nominalAtm: 12,
  rbpAtm: 20,
  growthAtRbpMm: 0.25,
  diameters: [2.0, 2.25, 2.5, 3.0, 3.5, 3.75, 4.0, 4.5],
};
const noGrowth: BalloonFamilyStock = {
  ...nc,
  name: "Illustrative SC family",
  compliance: "sc",
  growthAtRbpMm: null,
};

function size(p: BalloonPick): number {
  if (!p.ok) throw new Error(p.reason);
  return p.diameterMm;
}

describe("default rounding per lookup (common practice)", () => {
  it("POT up, side branch down, main branch nearest", () => {
    expect(DEFAULT_ROUNDING).toEqual({ proximal: "up", side: "down", main: "nearest" });
    expect(STOCK_TOLERANCE_MM).toBe(0.01);
  });
});

describe("up / down between two stocked sizes", () => {
  it("POT rounds up and side branch rounds down", () => {
    expect(size(pickBalloon(3.39, nc, "up"))).toBe(3.5);
    expect(size(pickBalloon(3.39, nc, "down"))).toBe(3.0);
    expect(size(pickBalloon(2.3, nc, "up"))).toBe(2.5);
    expect(size(pickBalloon(2.3, nc, "down"))).toBe(2.25);
  });

  it("skips out-of-stock gaps", () => {
    expect(size(pickBalloon(2.6, nc, "up"))).toBe(3.0);
    expect(size(pickBalloon(3.2, nc, "up"))).toBe(3.5);
    expect(size(pickBalloon(3.45, nc, "down"))).toBe(3.0);
    expect(size(pickBalloon(4.4, nc, "down"))).toBe(4.0);
  });

  it("a target within 0.01 mm of a stocked size is that size", () => {
    expect(size(pickBalloon(4.004, nc, "up"))).toBe(4.0);
    expect(size(pickBalloon(3.996, nc, "down"))).toBe(4.0);
    expect(size(pickBalloon(4.01, nc, "up"))).toBe(4.0);
    expect(size(pickBalloon(4.0101, nc, "up"))).toBe(4.5);
    expect(size(pickBalloon(3.9899, nc, "down"))).toBe(3.75);
    expect(size(pickBalloon(0.1 + 0.2 + 3.7, nc, "up"))).toBe(4.0);
  });

  it("explains targets outside the stock", () => {
    expect(pickBalloon(4.63, nc, "up")).toEqual({
      ok: false,
      code: "above_stock",
      reason: "No stocked size at or above 4.63 mm",
    });
    expect(pickBalloon(1.9, nc, "down")).toEqual({
      ok: false,
      code: "below_stock",
      reason: "Below the smallest stocked size (2.00 mm)",
    });
    // Never a jump to a distant size outside the stocked range, whatever the rule.
    expect(pickBalloon(1.5, nc, "up")).toMatchObject({ ok: false, code: "below_stock" });
    expect(pickBalloon(5.2, nc, "down")).toEqual({
      ok: false,
      code: "above_stock",
      reason: "Above the largest stocked size (4.50 mm)",
    });
    expect(pickBalloon(3, { ...nc, diameters: [] }, "up")).toEqual({
      ok: false,
      code: "no_stock",
      reason: "No sizes in stock",
    });
  });

  it("ignores the order and repeats of the stock list", () => {
    expect(size(pickBalloon(3.1, { ...nc, diameters: [4.0, 3.5, 3.5, 3.0] }, "up"))).toBe(3.5);
  });
});

describe("nearest", () => {
  it("takes the closest stocked size, a tie going to the smaller", () => {
    expect(size(pickBalloon(3.24, nc, "nearest"))).toBe(3.0);
    expect(size(pickBalloon(3.26, nc, "nearest"))).toBe(3.5);
    expect(size(pickBalloon(3.25, nc, "nearest"))).toBe(3.0); // tie: 0.25 either side
    expect(size(pickBalloon(2.125, nc, "nearest"))).toBe(2.0); // tie: 0.125 either side
  });

  it("has no nearest size outside the stocked range", () => {
    expect(pickBalloon(4.6, nc, "nearest")).toMatchObject({ ok: false, code: "above_stock" });
    expect(size(pickBalloon(4.505, nc, "nearest"))).toBe(4.5);
    expect(pickBalloon(1.8, nc, "nearest")).toMatchObject({ ok: false, code: "below_stock" });
  });
});

describe("reach by pressure (illustrative compliance: 12 atm nominal, 20 atm RBP, +0.25 mm at RBP)", () => {
  it("4.0 reaches 4.1 at 12 + 8 × 0.1/0.25 = 15.2, rounded up to 16 atm", () => {
    const p = pickBalloon(4.1, nc, "reach");
    expect(p).toMatchObject({ ok: true, diameterMm: 4.0, pressureAtm: 16, rule: "reach" });
    expect(p.ok && p.expectedMm).toBeCloseTo(4.125, 12); // 4.0 + 0.25 × 4/8
  });

  it("a whole-atm pressure is not pushed up by floating-point noise", () => {
    // 10 + 8 × 0.15/0.3 = 14 exactly.
    const fam = { ...nc, nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0.3 };
    expect(pickBalloon(4.15, fam, "reach")).toMatchObject({ diameterMm: 4.0, pressureAtm: 14 });
    // 12 + 8 × 0.0625/0.25 = 14 exactly.
    expect(pickBalloon(4.0625, nc, "reach")).toMatchObject({ diameterMm: 4.0, pressureAtm: 14 });
  });

  it("reaching exactly at rated burst pressure is allowed", () => {
    expect(pickBalloon(4.25, nc, "reach")).toMatchObject({ diameterMm: 4.0, pressureAtm: 20 });
  });

  it("beyond the growth, or when rounding up would pass RBP, the next size at nominal", () => {
    expect(pickBalloon(4.26, nc, "reach")).toMatchObject({ diameterMm: 4.5, pressureAtm: null });
    // 12 + 7.5 × 0.24/0.25 = 19.2 -> 20 atm > 19.5 RBP: 4.0 cannot reach.
    const fam = { ...nc, rbpAtm: 19.5 };
    expect(pickBalloon(4.24, fam, "reach")).toMatchObject({ diameterMm: 4.5, pressureAtm: null });
  });

  it("a stocked match is used at nominal pressure", () => {
    expect(pickBalloon(4.005, nc, "reach")).toMatchObject({ diameterMm: 4.0, pressureAtm: null });
    expect(pickBalloon(1.5, nc, "reach")).toMatchObject({ ok: false, code: "below_stock" });
  });

  it("takes the size that needs the lowest pressure, not the smallest that reaches (common practice)", () => {
    // Growth 0.5 mm: 3.0 would reach 3.4 only at 12 + 8 x 0.4/0.5 = 18.4 -> 19 atm; 3.25 needs 12 + 8 x 0.15/0.5 = 14.4 -> 15 atm.
    const wide = { ...nc, growthAtRbpMm: 0.5, diameters: [3.0, 3.25, 3.5] };
    expect(pickBalloon(3.4, wide, "reach")).toMatchObject({ diameterMm: 3.25, pressureAtm: 15, rule: "reach" });
  });

  it("skips gaps: 2.5 cannot reach 2.9 (+0.25 at most), so 3.0 at nominal", () => {
    expect(pickBalloon(2.9, nc, "reach")).toMatchObject({ diameterMm: 3.0, pressureAtm: null });
    // 2.5 reaches 2.7 at 12 + 8 × 0.8 = 18.4 -> 19 atm.
    expect(pickBalloon(2.7, nc, "reach")).toMatchObject({ diameterMm: 2.5, pressureAtm: 19 });
  });

  it("above the largest size and its growth: no stock", () => {
    expect(pickBalloon(4.8, nc, "reach")).toMatchObject({ ok: false, code: "above_stock" });
    // 12 + 8 × 0.2/0.25 = 18.4 -> 19 atm.
    expect(pickBalloon(4.7, nc, "reach")).toMatchObject({ diameterMm: 4.5, pressureAtm: 19 });
  });

  it("falls back to up without growth data", () => {
    expect(pickBalloon(4.1, noGrowth, "reach")).toMatchObject({
      ok: true,
      diameterMm: 4.5,
      pressureAtm: null,
      rule: "up",
    });
    expect(pickBalloon(4.1, { ...nc, rbpAtm: 12 }, "reach")).toMatchObject({
      diameterMm: 4.5,
      rule: "up",
    });
  });

  it("linear compliance between nominal and RBP", () => {
    expect(balloonDiameterAt(nc, 3.0, 12)).toBe(3.0);
    expect(balloonDiameterAt(nc, 3.0, 20)).toBeCloseTo(3.25, 12);
    expect(balloonDiameterAt(nc, 3.0, 16)).toBeCloseTo(3.125, 12);
    expect(balloonDiameterAt(noGrowth, 3.0, 16)).toBe(3.0);
  });
});

describe("input guard", () => {
  it("throws on a non-positive or non-finite target", () => {
    expect(() => pickBalloon(0, nc, "up")).toThrow(RangeError);
    expect(() => pickBalloon(Number.NaN, nc, "up")).toThrow(RangeError);
  });
});
