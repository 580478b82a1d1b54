import { describe, expect, it } from "vitest";
import { lawFit } from "@/lib/sizing/fit";

// Fit ranges as reported in Huo Y, Finet G, Lefevre T, et al. EuroIntervention 2012.
describe("law fit by Dsb/Dmb", () => {
  it("Huo-Kassab fitted every type", () => {
    for (const sb of [0.5, 1, 2, 3]) expect(lawFit({ law: "huo-kassab" }, 3, sb).withinPublishedFit).toBe(true);
  });

  it("Finet fitted mainly near-symmetric bifurcations (>= 0.75)", () => {
    const finet = { law: "finet", ratio: 0.678 } as const;
    expect(lawFit(finet, 4, 3).withinPublishedFit).toBe(true); // 0.75
    expect(lawFit(finet, 4, 4).withinPublishedFit).toBe(true);
    const out = lawFit(finet, 4, 2.96); // 0.74
    expect(out.withinPublishedFit).toBe(false);
    expect(out.note).toContain("near-symmetric");
    expect(out.note).toContain("0.740");
  });

  it("Murray and square fitted mainly very asymmetric bifurcations (<= 0.25)", () => {
    for (const law of ["murray", "square"] as const) {
      expect(lawFit({ law }, 4, 1).withinPublishedFit).toBe(true); // 0.25
      expect(lawFit({ law }, 4, 0.6).withinPublishedFit).toBe(true);
      const out = lawFit({ law }, 4, 1.04); // 0.26
      expect(out.withinPublishedFit).toBe(false);
      expect(out.note).toContain("very asymmetric");
    }
  });

  it("a power law with a chosen n has no published range and is never marked outside", () => {
    const fit = lawFit({ law: "power", n: 2.3 }, 4, 2);
    expect(fit.withinPublishedFit).toBe(true);
    expect(fit.note).toContain("No published fit range");
  });
});
