import { describe, expect, it } from "vitest";
import { diffCells } from "@/lib/charts/cell-diff";
import { buildSnapshot } from "@/lib/charts/snapshot";
import { smallPotChart } from "../../support/chart-fixtures";
import { ncStock } from "../../support/chart-fixtures";

const stock = (out: number[] = []) => ncStock(out);
const definition = smallPotChart(1, "POT test chart");
const snap = (out: number[] = []) =>
  buildSnapshot({ labName: "Test lab", definition, stock: stock(out), logoSha256: null });
const withRatio = (ratio: number) =>
  buildSnapshot({
    labName: "Test lab",
    definition: { ...definition, law: { law: "finet", ratio } },
    stock: stock(),
    logoSha256: null,
  });

describe("diffCells", () => {
  it("finds no difference between a snapshot and itself", () => {
    expect(diffCells(snap(), snap())).toEqual([]);
  });

  it("names exactly the cells whose printed balloon changes when a size leaves stock, with both values", () => {
    const before = snap();
    const after = snap([3.75]);
    const diff = diffCells(before, after);
    expect(diff.length).toBeGreaterThan(0);
    // Every cell that printed 3.75 mm now prints something else, and no other cell changed.
    for (const d of diff) {
      expect(d.printed.text).toMatch(/^3\.75 mm/);
      expect(d.other?.text).not.toMatch(/^3\.75 mm/);
      expect(d.where).toMatch(/^Main branch \d\.\d+ mm × side branch \d\.\d+ mm$/);
    }
    expect(diff[0]!.other!.text).toMatch(/^4\.0 mm/);
  });

  it("counts every printed cell as affected when there is nothing to compare with", () => {
    const s = snap();
    const cells = s.lookups[0]!.rows.length * s.lookups[0]!.cols.length;
    const diff = diffCells(s, null);
    expect(diff).toHaveLength(cells);
    expect(diff.every((d) => d.other === null)).toBe(true);
  });

  it("lists only cells a reader can see differ: where the balloon is the same, the small print says what changed", () => {
    const diff = diffCells(withRatio(0.678), withRatio(0.69));
    expect(diff.length).toBeGreaterThan(0);
    for (const d of diff) expect(d.printed.text, d.where).not.toBe(d.other?.text);
    // A slightly larger ratio moves exact diameters without always moving the balloon.
    const sameBalloon = diff.filter((d) => d.printed.text.split(" (")[0] === d.other?.text.split(" (")[0]);
    expect(sameBalloon.length).toBeGreaterThan(0);
    for (const d of sameBalloon) {
      expect(d.printed.text).toMatch(/\(.*exact \d\.\d\d mm/);
      expect(d.other?.text).toMatch(/\(.*exact \d\.\d\d mm/);
    }
  });
});
