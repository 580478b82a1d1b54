import { describe, expect, it } from "vitest";
import { approvalText, gridSubtitle, lookupTitle, shortUrl, statusBanner } from "@/lib/poster/labels";
import { cellView, CELL_BACKGROUNDS, cornerSymbols, formatBalloonMm, legendEntries, MARKS } from "@/lib/poster/marks";
import { buildGrid, type BalloonFamilyStock, type Cell } from "@/lib/sizing";

// Invented, illustrative family for the tests only.
const family: BalloonFamilyStock = {
  name: "Test NC",
  compliance: "nc",
  nominalAtm: 12,
  rbpAtm: 20,
  growthAtRbpMm: 0.25,
  diameters: [2.5, 2.75, 3, 3.25, 3.5],
};
const cellAt = (cells: Cell[][], row: number, col: number) =>
  cells.flat().find((c) => c.row === row && c.col === col) as Cell;

describe("cellView", () => {
  const grid = buildGrid({
    kind: "proximal",
    rows: [2.5, 3, 3.5],
    cols: [1, 2, 3, 3.25],
    law: { law: "finet", ratio: 0.678 },
    rounding: "up",
    family,
    stent: [{ nominalMm: 3, maxPostDilatationMm: 3.5 }],
  });

  it("prints the stocked balloon large and the exact diameter small", () => {
    const v = cellView(cellAt(grid.cells, 2.5, 2)); // Finet: 0.678 x 4.5 = 3.051 -> up to 3.25
    expect(v).toMatchObject({
      primary: "3.25",
      exact: "(3.05)",
      primaryIsSize: true,
      marks: [],
      background: CELL_BACKGROUNDS.sized,
      border: 0,
    });
    // 0.678 x 5 = 3.39 -> 3.5, which reaches 3.75 mm at RBP (+0.25 mm growth) > the 3.5 limit;
    // and Dsb/Dmb 0.67 < 0.75 is outside Finet's published fit.
    expect(cellView(cellAt(grid.cells, 3, 2)).marks).toEqual(["hazard", "outsideFit"]);
    expect(v.description).toContain("3.25 mm balloon at nominal pressure");
    expect(v.description).toContain("exact 3.05 mm");
  });

  it("marks impossible geometry with a dash on grey hatching, never a number", () => {
    const v = cellView(cellAt(grid.cells, 2.5, 3)); // SB above MB: no bifurcation
    expect(v).toMatchObject({
      primary: "—",
      exact: null,
      marks: ["noSize"],
      hatch: true,
      background: CELL_BACKGROUNDS.noSize,
    });
    expect(v.description).toMatch(/^No size: /);
    const tooSmall = cellView(cellAt(grid.cells, 3, 1)); // Finet: SB under 0.475 MB gives no parent above MB
    expect(tooSmall.marks).toEqual(["noSize"]);
  });

  it("marks a size above the stocked range with ▲ on blue, and the stent hazard with ■ and a heavy border", () => {
    const v = cellView(cellAt(grid.cells, 3.5, 3)); // 0.678 x 6.5 = 4.407: above 3.5, and MB 3.5 has no stent
    expect(v.primary).toBe("▲");
    expect(v.marks).toEqual(["noStock", "hazard"]);
    expect(v.background).toBe(CELL_BACKGROUNDS.hazard);
    expect(v.border).toBeGreaterThan(0);
    expect(cornerSymbols(v)).toBe("■");
    expect(v.description).toContain("No stocked size");
    expect(v.description).toContain("Stent limit");
  });

  it("prints the pressure when reach pushes a balloon", () => {
    const reach = buildGrid({
      kind: "proximal",
      rows: [2.5],
      cols: [2.25],
      law: { law: "finet", ratio: 0.678 },
      rounding: "reach",
      family,
    });
    // 0.678 x 4.75 = 3.2205 mm; the 3.0 balloon grows 0.25 mm from 12 to 20 atm, so it needs
    // 12 + 8 x 0.2205 / 0.25 = 19.06 atm, rounded up to 20.
    expect(cellView(reach.cells[0]![0]!)).toMatchObject({ primary: "3.0", pressure: "@ 20 atm", exact: "(3.22)" });
  });

  it("prints the exact diameter large when the chart has no balloon family", () => {
    const bare = buildGrid({
      kind: "side",
      rows: [3.5],
      cols: [2.5],
      law: { law: "square" },
      rounding: "down",
      family: null,
    });
    expect(cellView(bare.cells[0]![0]!)).toMatchObject({
      primary: Math.sqrt(3.5 ** 2 - 2.5 ** 2).toFixed(2),
      exact: null,
    });
  });
});

describe("labels", () => {
  it("formats shelf sizes with one or two decimals", () => {
    expect([2.5, 2.75, 3, 4.0].map(formatBalloonMm)).toEqual(["2.5", "2.75", "3.0", "4.0"]);
  });

  it("names what each lookup solves and from what", () => {
    expect(lookupTitle("proximal")).toBe("POT balloon (parent) from main branch × side branch");
    expect(lookupTitle("side")).toBe("Side-branch balloon from parent × main branch");
    expect(lookupTitle("main")).toBe("Main-branch balloon from parent × side branch");
  });

  it("says who approved when, or that it is a draft", () => {
    expect(
      approvalText({
        status: "approved",
        approvedAt: new Date(Date.UTC(2026, 0, 5, 23, 59)),
        approvedByName: "B. Test",
      }),
    ).toBe("Approved 2026-01-05 by B. Test");
    expect(approvalText({ status: "draft", approvedAt: null, approvedByName: null })).toBe("DRAFT — not approved");
    expect(statusBanner("approved")).toBeNull();
    expect(statusBanner("withdrawn")).toContain("WITHDRAWN");
    expect(shortUrl("https://forkwall.example/c/abc/")).toBe("forkwall.example/c/abc");
  });

  it("puts family, rounding and the stent limit under a POT grid", () => {
    expect(gridSubtitle({ kind: "proximal", rounding: "up", family }, null)).toBe(
      "Test NC: NC, nominal 12 atm, RBP 20 atm · Balloon rounded up to the next stocked size (common practice) · Stent limit not checked (no stent platform)",
    );
  });

  it("words the legend for the chart's own law and stent", () => {
    const finet = legendEntries({
      law: { law: "finet", ratio: 0.678 },
      stentName: "Test DES",
      hasProximal: true,
      hasReach: true,
    });
    expect(finet.map((e) => e.mark)).toEqual([
      "sized",
      "noSize",
      "noStock",
      "hazard",
      "oversize",
      "undersize",
      "nearRbp",
      "outsideFit",
    ]);
    expect(finet.find((e) => e.mark === "oversize")!.text).toContain("more than 0.25 mm above");
    expect(finet.find((e) => e.mark === "undersize")!.text).toContain("more than 0.5 mm below");
    // A fixed example pressure could exceed a family's RBP, so the legend names none.
    expect(finet[0]!.text).toContain("“@ N atm”");
    expect(finet[0]!.text).toContain("never above rated burst pressure");
    expect(finet[0]!.detail).toContain("the device's own compliance chart rules");
    expect(finet.find((e) => e.mark === "hazard")!.text).toContain("Test DES");
    // The poster prints the short line; the check page gets the whole rule.
    expect(finet.find((e) => e.mark === "hazard")!.detail).toContain("the nearest nominal at or below it");
    expect(finet.find((e) => e.mark === "outsideFit")!.text).toContain("Dsb/Dmb ≥ 0.75");
    const hk = legendEntries({ law: { law: "huo-kassab" }, stentName: null, hasProximal: true, hasReach: false });
    expect(hk.find((e) => e.mark === "hazard")!.text).toContain("Not checked");
    expect(hk.find((e) => e.mark === "outsideFit")!.text).toContain("no cell is marked");
    expect(hk.find((e) => e.mark === "noSize")!.label).toBe(`${MARKS.noSize.symbol} No size`);
  });
});
