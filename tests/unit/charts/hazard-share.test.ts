import { describe, expect, it } from "vitest";
import { buildSnapshot, snapshotGrids, type LabStock } from "@/lib/charts/snapshot";
import { HAZARD_SHARE_LIMIT, hazardShares } from "@/lib/charts/hazard-share";
import { cellView } from "@/lib/poster/marks";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { demoStock, potDefinition, snapshotOf } from "../../support/poster-fixtures";

/** Sized cells and those marked, counted from the printed cell views (not the function under test). */
function printed(snapshot: ReturnType<typeof snapshotOf>) {
  const views = snapshotGrids(snapshot)[0]!.cells.flat().map(cellView);
  const sized = views.filter((v) => v.primaryIsSize && !v.marks.includes("noStock"));
  return { sized: sized.length, hazard: sized.filter((v) => v.marks.includes("hazard")).length };
}

// An invented second platform whose sizes post-dilate further.
const wideStent = {
  id: 8,
  name: "Illustrative wide DES",
  sizes: [
    { nominalMm: 2.5, maxPostDilatationMm: 4 },
    { nominalMm: 3, maxPostDilatationMm: 5 },
    { nominalMm: 3.5, maxPostDilatationMm: 5.5 },
    { nominalMm: 4, maxPostDilatationMm: 6 },
  ],
};
const stock: LabStock = { ...demoStock, stentPlatforms: [...demoStock.stentPlatforms, wideStent] };

describe("hazardShares", () => {
  const snapshot = snapshotOf(potDefinition);

  it("warns when more than a third of a lookup's sized cells carry the stent-limit mark", () => {
    const count = printed(snapshot);
    expect(count.hazard).toBeGreaterThan(count.sized * HAZARD_SHARE_LIMIT);
    const [w] = hazardShares(snapshot, stock);
    expect(w).toMatchObject({ lookupIndex: 0, kind: "proximal", sized: count.sized, hazard: count.hazard });
    expect(w!.message).toContain(`${count.hazard} of ${count.sized} sized cells`);
  });

  it("names a stent platform in stock that marks fewer cells, and the count it would give", () => {
    const [w] = hazardShares(snapshot, stock);
    const other = snapshotOf({ ...potDefinition, stentPlatformId: 8 });
    const theirs = buildSnapshot({
      labName: "Illustrative Cath Lab (demo)",
      definition: chartDefinitionSchema.parse({ ...potDefinition, stentPlatformId: 8 }),
      stock,
      logoSha256: null,
    });
    expect(other.stent).toBeNull(); // the demo stock alone lacks it
    const expected = printed(theirs).hazard;
    expect(expected).toBeLessThan(w!.hazard);
    expect(w!.changes.map((c) => c.message)).toContain(
      `Choose the Illustrative wide DES stent platform: ${expected} cell${expected === 1 ? "" : "s"} marked.`,
    );
    for (const c of w!.changes) expect(c.hazard).toBeLessThan(w!.hazard);
  });

  it("suggests a larger post-dilatation limit for one stent size when the stock offers nothing better", () => {
    const [w] = hazardShares(snapshot, demoStock);
    expect(w!.changes.length).toBeGreaterThan(0);
    expect(w!.changes.some((c) => /^A [\d.]+ mm stent that post-dilates to [\d.]+ mm/.test(c.message))).toBe(true);
    // A family that leaves cells without a stocked size is no cure: never suggested.
    expect(w!.changes.some((c) => c.message.includes("SC balloon"))).toBe(false);
  });

  it("says nothing when the mark stays rare or there is no stent check", () => {
    const noStent = snapshotOf({ ...potDefinition, stentPlatformId: undefined });
    expect(hazardShares(noStent, demoStock)).toEqual([]);
    const theirs = buildSnapshot({
      labName: "x",
      definition: chartDefinitionSchema.parse({ ...potDefinition, stentPlatformId: 8 }),
      stock,
      logoSha256: null,
    });
    const c = printed(theirs);
    expect(c.hazard).toBeLessThanOrEqual(c.sized * HAZARD_SHARE_LIMIT);
    expect(hazardShares(theirs, stock)).toEqual([]);
  });
});
