import { describe, expect, it } from "vitest";
import { candidateStents, checkPot, potHazard, type StentSize } from "@/lib/sizing/stent";

// Illustrative platform, invented for tests.
const platform: StentSize[] = [
  { nominalMm: 4.0, maxPostDilatationMm: 5.0 },
  { nominalMm: 2.5, maxPostDilatationMm: 3.5 },
  { nominalMm: 3.0, maxPostDilatationMm: 3.75 },
  { nominalMm: 3.5, maxPostDilatationMm: 4.5 },
];

describe("candidate main-branch stents: every nominal from the nearest at or below to the nearest at or above", () => {
  const nominals = (mb: number) => {
    const p = candidateStents(mb, platform);
    return p.ok ? p.stents.map((s) => s.nominalMm) : null;
  };
  it("takes both neighbours when the main branch falls between two nominals (common practice)", () => {
    // Reference: an operator may round a 2.8 mm main branch down to 2.5 or up to 3.0 (common practice).
    expect(nominals(2.8)).toEqual([2.5, 3.0]);
    expect(nominals(2.9)).toEqual([2.5, 3.0]);
    expect(nominals(3.2)).toEqual([3.0, 3.5]);
  });
  it("takes the one nominal a main branch matches (0.01 mm tolerance)", () => {
    expect(nominals(3.0)).toEqual([3.0]);
    expect(nominals(3.005)).toEqual([3.0]);
  });
  it("takes the smallest below the platform and none above it", () => {
    expect(nominals(2.2)).toEqual([2.5]);
    expect(nominals(4.2)).toBeNull();
    expect(candidateStents(4.2, platform)).toEqual({
      ok: false,
      reason: "No stent nominal at or above 4.20 mm in the platform",
    });
  });
  it("keeps a nominal listed twice with both limits", () => {
    const p = candidateStents(3, [...platform, { nominalMm: 3.0, maxPostDilatationMm: 3.6 }]);
    expect(p.ok && p.stents.map((s) => s.maxPostDilatationMm)).toEqual([3.6, 3.75]);
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

  it("checks against the lowest limit of every candidate stent", () => {
    // Illustrative limits (common practice: a 2.5 mm stent often post-dilates to about 3.5 mm):
    // a 2.8 mm main branch may get the 2.5 mm stent (limit 3.5), so 3.7 mm is a hazard even
    // though the 3.0 mm stent's own limit (3.75) would allow it.
    expect(checkPot(3.7, 2.8, platform)).toEqual({
      hazard: true,
      detail: "POT 3.70 mm exceeds the 2.50 mm stent's maximum post-dilatation diameter (3.50 mm)",
    });
    expect(checkPot(3.5, 2.8, platform)).toEqual({ hazard: false });
  });

  it("explains the hazard, and marks a main branch no stent covers", () => {
    expect(checkPot(3.5, 3.0, platform)).toEqual({ hazard: false });
    expect(checkPot(4.0, 3.0, platform)).toEqual({
      hazard: true,
      detail: "POT 4.00 mm exceeds the 3.00 mm stent's maximum post-dilatation diameter (3.75 mm)",
    });
    // Words use the one decimal-label function: 5.085 is "5.09", not binary rounding's "5.08".
    expect(checkPot(5.085, 4.0, platform).detail).toContain("POT 5.09 mm");
    const none = checkPot(5.0, 4.2, platform);
    expect(none.hazard).toBe(true);
    expect(none.detail).toContain("cannot be checked");
  });
});
