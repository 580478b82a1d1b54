import { describe, expect, it } from "vitest";
import { formulaLines } from "@/lib/poster/labels";

describe("formulaLines", () => {
  const finet = "Dp = 0.678 × (Dmb + Dsb)";

  it("keeps a formula that fits on one line at its size", () => {
    expect(formulaLines(finet, 20, 1000)).toEqual({ lines: [finet], size: 20 });
  });

  it("breaks only after the '=', never inside the expression", () => {
    const { lines, size } = formulaLines(finet, 20, 260);
    expect(lines).toEqual(["Dp =", "0.678 × (Dmb + Dsb)"]);
    expect(size).toBe(20);
  });

  it("shrinks until the longest piece fits, so the line never wraps", () => {
    const { lines, size } = formulaLines(finet, 20, 100);
    expect(lines).toHaveLength(2);
    expect(size).toBeLessThan(20);
    // 19 characters at the overestimated 0.66 em fill the 100 pt exactly.
    expect(size * 0.66 * "0.678 × (Dmb + Dsb)".length).toBeCloseTo(100, 6);
  });

  it("shrinks a formula with no '=' rather than breaking it", () => {
    expect(formulaLines("Dmb + Dsb", 20, 50).lines).toEqual(["Dmb + Dsb"]);
  });
});
