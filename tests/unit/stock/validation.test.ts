import { describe, expect, it } from "vitest";
import { DEMO_STOCK } from "@/db/seed-stock";
import {
  balloonFamilyInput,
  balloonFamilyPatch,
  balloonInput,
  balloonPatch,
  importQuery,
  onGrid,
  stentSizeInput,
} from "@/lib/validation/stock";

const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  (r.error?.issues ?? []).map((i) => `${i.path.join(".")}: ${i.message}`);

describe("stock validation", () => {
  it("onGrid tolerates floating-point noise and nothing more", () => {
    expect(onGrid(2.3, 0.05)).toBe(true);
    expect(onGrid(0.1 + 0.2, 0.1)).toBe(true);
    expect(onGrid(2.33, 0.05)).toBe(false);
    expect(onGrid(2.301, 0.05)).toBe(false);
  });

  it("a balloon family: nominal below burst, pressures 1 to 40 in 0.1, growth 0 to 1, name 1 to 120", () => {
    const ok = { name: " Fam ", compliance: "nc", nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: 0.2 };
    expect(balloonFamilyInput.parse(ok)).toEqual({ ...ok, name: "Fam" });
    expect(balloonFamilyInput.parse({ ...ok, growthAtRbpMm: undefined }).growthAtRbpMm).toBeUndefined();
    expect(messages(balloonFamilyInput.safeParse({ ...ok, nominalAtm: 20 }))).toEqual([
      "rbpAtm: Rated burst pressure must be above the nominal pressure.",
    ]);
    expect(messages(balloonFamilyInput.safeParse({ ...ok, rbpAtm: 40.5 }))).toEqual([
      "rbpAtm: Rated burst pressure must be at most 40 atm.",
    ]);
    expect(messages(balloonFamilyInput.safeParse({ ...ok, growthAtRbpMm: 1.01 }))).toEqual([
      "growthAtRbpMm: Growth at rated burst pressure must be at most 1.00 mm.",
    ]);
    expect(messages(balloonFamilyInput.safeParse({ ...ok, name: "  " }))).toEqual(["name: Enter the family name."]);
    expect(messages(balloonFamilyInput.safeParse({ ...ok, compliance: "xc" }))).toEqual([
      'compliance: Compliance must be "nc" (non-compliant) or "sc" (semi-compliant).',
    ]);
    expect(messages(balloonFamilyInput.safeParse({ ...ok, nominalAtm: Number.NaN }))).toEqual([
      "nominalAtm: Nominal pressure must be a number.",
    ]);
    expect(messages(balloonFamilyInput.safeParse({ ...ok, extra: 1 }))).toEqual([': Unrecognized key: "extra"']);
  });

  it("snaps values to their grid so 2.7500000001 is stored as 2.75", () => {
    expect(balloonInput.parse({ diameterMm: 2.7500000001 }).diameterMm).toBe(2.75);
    expect(balloonInput.parse({ diameterMm: 3 })).toEqual({ diameterMm: 3, inStock: true });
  });

  it("patches need at least one known field", () => {
    expect(messages(balloonPatch.safeParse({}))).toEqual([": Send at least one field to change."]);
    expect(balloonPatch.parse({ inStock: false })).toEqual({ inStock: false });
    expect(messages(balloonPatch.safeParse({ inStock: "no" }))).toEqual(["inStock: In stock must be true or false."]);
    expect(balloonFamilyPatch.parse({ growthAtRbpMm: null })).toEqual({ growthAtRbpMm: null });
  });

  it("a stent size: post-dilatation from the nominal up to nominal + 2.00 mm", () => {
    expect(stentSizeInput.parse({ nominalMm: 3, maxPostDilatationMm: 5 })).toEqual({
      nominalMm: 3,
      maxPostDilatationMm: 5,
    });
    expect(messages(stentSizeInput.safeParse({ nominalMm: 3, maxPostDilatationMm: 2.95 }))).toEqual([
      "maxPostDilatationMm: Maximum post-dilatation diameter must be at least the nominal diameter (3.00 mm).",
    ]);
    expect(messages(stentSizeInput.safeParse({ nominalMm: 3, maxPostDilatationMm: 5.05 }))).toEqual([
      "maxPostDilatationMm: Maximum post-dilatation diameter must be at most nominal + 2.00 mm (5.00 mm).",
    ]);
  });

  it("URL parts are bounded", () => {
    expect(importQuery.parse({ dryRun: "1" })).toEqual({ dryRun: true });
    expect(importQuery.parse({})).toEqual({ dryRun: false });
    expect(importQuery.safeParse({ dryRun: "yes" }).success).toBe(false);
  });

  it("the invented demo stock passes the same rules as user input", () => {
    for (const { families, platforms } of Object.values(DEMO_STOCK)) {
      for (const f of families) {
        expect(
          balloonFamilyInput.safeParse({
            name: f.name,
            compliance: f.compliance,
            nominalAtm: f.nominalAtm,
            rbpAtm: f.rbpAtm,
            growthAtRbpMm: f.growthAtRbpMm,
          }).success,
        ).toBe(true);
        expect(f.name).toContain("(illustrative)");
        for (const d of f.diameters)
          expect(balloonInput.safeParse({ diameterMm: d }).success, `${f.name} ${d}`).toBe(true);
        expect(new Set(f.diameters).size).toBe(f.diameters.length);
      }
      for (const p of platforms) {
        expect(p.name).toContain("(illustrative)");
        for (const [nominalMm, maxPostDilatationMm] of p.sizes)
          expect(stentSizeInput.safeParse({ nominalMm, maxPostDilatationMm }).success, `${p.name} ${nominalMm}`).toBe(
            true,
          );
      }
    }
    const a = DEMO_STOCK.demo!.families[0]!;
    expect(a.diameters).toEqual([2, 2.25, 2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25, 4.5, 4.75, 5]);
  });
});
