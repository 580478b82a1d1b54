import { describe, expect, it } from "vitest";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { legibilityRefusal, LEGIBILITY_RULE, snapshotLegibility } from "@/lib/poster/model";
import { potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

describe("the legibility gate", () => {
  it("refuses figures below the 20′ guide at the stated distance, naming the rule and a way to pass", () => {
    const small = snapshotOf({ ...potDefinition, paper: "A4", readingDistanceM: 2.5 });
    const refusal = legibilityRefusal(small);
    expect(refusal).toMatch(/^Lab rule "legibility": the figures are too small to read from 2.5 m\./);
    // The designer's advice: a larger paper (or fewer columns, or a closer distance).
    expect(refusal).toMatch(/use A\d or larger|show at most \d+ columns?|print it landscape/i);
  });

  it("lets an edition through when the medical lead recorded an exception to the rule", () => {
    const small = snapshotOf({ ...potDefinition, paper: "A4", readingDistanceM: 2.5 });
    const excepted = { ...small, ruleExceptions: [{ rule: LEGIBILITY_RULE, reason: "Read at the table only" }] };
    expect(legibilityRefusal(excepted)).toBeNull();
    // An exception to another rule does not count.
    expect(legibilityRefusal({ ...small, ruleExceptions: [{ rule: "rounding", reason: "x" }] })).not.toBeNull();
  });

  it("passes every demo chart at its stated control-room distance of 2-3 m", () => {
    for (const chart of DEMO_CHARTS) {
      const def = chart.definition({ nc: 1, sc: 2, stent: 7 }) as { readingDistanceM: number };
      expect(def.readingDistanceM, chart.title).toBeGreaterThanOrEqual(2);
      expect(def.readingDistanceM, chart.title).toBeLessThanOrEqual(3);
      const snapshot = snapshotOf(def as never);
      expect(legibilityRefusal(snapshot), chart.title).toBeNull();
      expect(snapshotLegibility(snapshot, { status: "approved" }).ok).toBe(true);
    }
  });
});
