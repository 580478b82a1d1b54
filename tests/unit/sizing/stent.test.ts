import { describe, expect, it } from "vitest";
import { checkPot, potHazard, stentForMainBranch, type StentSize } from "@/lib/sizing/stent";

// Illustrative platform, invented for tests.
const platform: StentSize[] = [
  { nominalMm: 4.0, maxPostDilatationMm: 5.0 },
  { nominalMm: 2.5, maxPostDilatationMm: 3.5 },
  { nominalMm: 3.0, maxPostDilatationMm: 3.75 },
  { nominalMm: 3.5, maxPostDilatationMm: 4.5 },
];

describe("main-branch stent: smallest nominal at or above the main branch", () => {
  it("picks by the main-branch diameter", () => {
    const nominal = (mb: number) => {
      const p = stentForMainBranch(mb, platform);
      return p.ok ? p.stent.nominalMm : null;
    };
    expect(nominal(2.2)).toBe(2.5);
    expect(nominal(2.9)).toBe(3.0);
    expect(nominal(3.0)).toBe(3.0);
    expect(nominal(3.005)).toBe(3.0); // within 0.01
    expect(nominal(3.02)).toBe(3.5);
    expect(nominal(4.2)).toBeNull();
  });

  it("says why when no nominal is large enough", () => {
    expect(stentForMainBranch(4.2, platform)).toEqual({
      ok: false,
      reason: "No stent nominal at or above 4.20 mm in the platform",
    });
  });

  it("uses the lower limit when a nominal is listed twice", () => {
    const p = stentForMainBranch(3, [...platform, { nominalMm: 3.0, maxPostDilatationMm: 3.6 }]);
    expect(p.ok && p.stent.maxPostDilatationMm).toBe(3.6);
  });
});

describe("POT hazard", () => {
  const s30 = { nominalMm: 3.0, maxPostDilatationMm: 3.75 };
  it("is a hazard only above the maximum post-dilatation diameter (0.01 mm tolerance)", () => {
    expect(potHazard(3.75, s30)).toBe(false);
    expect(potHazard(3.76, s30)).toBe(false);
    expect(potHazard(3.77, s30)).toBe(true);
    expect(potHazard(4.0, s30)).toBe(true);
  });

  it("explains the hazard, and marks a main branch no stent covers", () => {
    expect(checkPot(3.5, 3.0, platform)).toEqual({ hazard: false });
    expect(checkPot(4.0, 3.0, platform)).toEqual({
      hazard: true,
      detail: "POT 4.00 mm exceeds the 3.00 mm stent's maximum post-dilatation diameter (3.75 mm)",
    });
    const none = checkPot(5.0, 4.2, platform);
    expect(none.hazard).toBe(true);
    expect(none.detail).toContain("cannot be checked");
  });
});
