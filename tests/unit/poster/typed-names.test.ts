import { describe, expect, it } from "vitest";
import { familyText, localiseNumbers } from "@/lib/poster/labels";
import type { BalloonFamilyStock } from "@/lib/sizing";

describe("the decimal-comma setting changes numbers the product formats, never names the lab typed", () => {
  const family: BalloonFamilyStock = {
    name: "V-NC1 growth 0.25 (illustrative)",
    compliance: "nc",
    nominalAtm: 12.5,
    rbpAtm: 20,
    growthAtRbpMm: 0.25,
    diameters: [3],
  };
  it("keeps the family's name as typed and localises its pressures", () => {
    const line = localiseNumbers(familyText(family), "comma", [family.name]);
    expect(line).toBe("V-NC1 growth 0.25 (illustrative): NC, nominal 12,5 atm, RBP 20 atm");
    // Without the name protected the old behaviour rewrote it (the finding).
    expect(localiseNumbers(familyText(family), "comma")).toContain("growth 0,25");
    expect(localiseNumbers("3.5 mm", "point", [family.name])).toBe("3.5 mm");
    expect(localiseNumbers("a.b 1.5 (x.1)", "comma", ["(x.1)", ""])).toBe("a.b 1,5 (x.1)");
  });
});
