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

  it("does not let an exception approve figures nobody can read, even from arm's length", () => {
    // A 3 x 3 grid on A4 portrait read from 2.5 m: headings sized for the distance leave the grid
    // (almost) no room, so the printed figures are a fraction of a millimetre high.
    const tiny = {
      ...potDefinition,
      paper: "A4",
      readingDistanceM: 2.5,
      lookups: [
        { ...potDefinition.lookups[0], rows: { from: 2.5, to: 3, step: 0.25 }, cols: { from: 2, to: 2.5, step: 0.25 } },
      ],
    } as const;
    const snapshot = snapshotOf(tiny);
    const figureMm = snapshotLegibility(snapshot, { status: "approved" }).figureHeightMm;
    // The floor: 20′ of arc at 0.4 m is 2·400·tan(10′) = 2.33 mm (the formula in lib/poster/legibility.ts).
    const floorMm = 2 * 400 * Math.tan(((10 / 60) * Math.PI) / 180);
    expect(figureMm).toBeLessThan(floorMm);
    const excepted = { ...snapshot, ruleExceptions: [{ rule: LEGIBILITY_RULE, reason: "Read at the table only" }] };
    expect(legibilityRefusal(excepted)).toMatch(
      /^Lab rule "legibility": the exception recorded for this chart excuses the reading distance, but these figures \(\d+\.\d mm high\) cannot be read even from 0\.4 m, where they need 2\.3 mm\./,
    );
    // The POT chart on A4 has small but real figures (5.8 mm): an exception still lets it through.
    const small = snapshotOf({ ...potDefinition, paper: "A4", readingDistanceM: 2.5 });
    expect(snapshotLegibility(small, { status: "approved" }).figureHeightMm).toBeGreaterThan(floorMm);
    expect(legibilityRefusal({ ...small, ruleExceptions: excepted.ruleExceptions })).toBeNull();
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
