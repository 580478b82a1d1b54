import { describe, expect, it } from "vitest";
import { DEFAULT_LAB_RULES, labRulesPatchSchema, readLabRules, reviewByDate } from "@/lib/labs/rules";

describe("lab rules", () => {
  it("reads stored rules over the defaults and falls back on a broken row", () => {
    expect(readLabRules(null)).toEqual(DEFAULT_LAB_RULES);
    expect(readLabRules({ reviewPeriodMonths: 6 })).toEqual({ reviewPeriodMonths: 6, managersMayApprove: false });
    expect(readLabRules({ reviewPeriodMonths: "six" })).toEqual(DEFAULT_LAB_RULES);
  });

  it("refuses unknown keys, wrong types and an empty change", () => {
    expect(labRulesPatchSchema.safeParse({ managersMayApprove: true }).success).toBe(true);
    for (const bad of [
      {},
      { other: 1 },
      { reviewPeriodMonths: 0 },
      { reviewPeriodMonths: 61 },
      { managersMayApprove: 1 },
    ])
      expect(labRulesPatchSchema.safeParse(bad).success, JSON.stringify(bad)).toBe(false);
  });

  it("puts the review-by date the period later, clamped to the end of a shorter month", () => {
    expect(reviewByDate(new Date("2026-03-15T10:00:00Z"), 12).toISOString()).toBe("2027-03-15T10:00:00.000Z");
    expect(reviewByDate(new Date("2026-01-31T10:00:00Z"), 1).toISOString()).toBe("2026-02-28T10:00:00.000Z");
    expect(reviewByDate(new Date("2027-11-30T00:00:00Z"), 3).toISOString()).toBe("2028-02-29T00:00:00.000Z");
  });
});
