import { describe, expect, it } from "vitest";
import { parseStockCsv } from "@/lib/stock/csv";
import { isEmptyPlan, planStockImport, summarisePlan } from "@/lib/stock/import-plan";
import type { BalloonFamilyView, StentPlatformView } from "@/lib/stock/types";

const HEADER = "family,platform,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm,max_post_dilatation_mm";

const FAMILIES: BalloonFamilyView[] = [
  {
    id: 1,
    name: "NC family A (illustrative)",
    compliance: "nc",
    nominalAtm: 12,
    rbpAtm: 20,
    growthAtRbpMm: 0.2,
    balloons: [{ id: 11, diameterMm: 3, inStock: true }],
  },
];
const PLATFORMS: StentPlatformView[] = [
  {
    id: 5,
    name: "Stent platform X (illustrative)",
    sizes: [
      { id: 51, nominalMm: 3, maxPostDilatationMm: 4.5 },
      { id: 52, nominalMm: 3.5, maxPostDilatationMm: 4.5 },
      { id: 53, nominalMm: 4, maxPostDilatationMm: 5.5 },
    ],
  },
];

describe("parseStockCsv: balloons and stents in one file", () => {
  it("reads a line naming a platform as a stent size and one naming a family as a balloon size", () => {
    const out = parseStockCsv(
      [
        HEADER,
        "NC family A (illustrative),,nc,3.00,yes,12,20,",
        ",Stent platform X (illustrative),,3.00,,,,4.50",
        ',Stent platform X (illustrative),,3.50,no,,,"4,50"',
      ].join("\n"),
    );
    expect(out.issues).toEqual([]);
    expect(out.rows).toEqual([
      expect.objectContaining({ line: 2, family: "NC family A (illustrative)", diameterMm: 3, inStock: true }),
    ]);
    expect(out.stentRows).toEqual([
      { line: 3, platform: "Stent platform X (illustrative)", nominalMm: 3, maxPostDilatationMm: 4.5, inStock: true },
      {
        line: 4,
        platform: "Stent platform X (illustrative)",
        nominalMm: 3.5,
        maxPostDilatationMm: 4.5,
        inStock: false,
      },
    ]);
  });

  it("reads a stent-only file and a table pasted from a spreadsheet (tabs)", () => {
    const stentsOnly = parseStockCsv("platform;diameter_mm;max_post_dilatation_mm\nP (illustrative);2,50;3,50\n");
    expect(stentsOnly.issues).toEqual([]);
    expect(stentsOnly.stentRows).toHaveLength(1);
    const pasted = parseStockCsv("platform\tdiameter_mm\tmax_post_dilatation_mm\nP (illustrative)\t2.5\t3.5\n");
    expect(pasted.delimiter).toBe("\t");
    expect(pasted.stentRows[0]).toMatchObject({ nominalMm: 2.5, maxPostDilatationMm: 3.5 });
  });

  it("names each bad stent line and column: limits, both names, balloon columns, missing columns", () => {
    const out = parseStockCsv(
      [
        HEADER,
        ",P (illustrative),,3.00,,,,2.75", // below nominal
        ",P (illustrative),,3.00,,,,6.00", // far above nominal
        "Fam (illustrative),P (illustrative),nc,3.00,yes,,,4.5",
        ",P (illustrative),nc,3.00,,,,4.5",
        ",P (illustrative),,3.00,maybe,,,",
      ].join("\n"),
    );
    expect(out.stentRows).toEqual([]);
    expect(out.issues).toEqual([
      {
        line: 2,
        column: "max_post_dilatation_mm",
        message: expect.stringContaining("must be at least the nominal diameter"),
      },
      { line: 3, column: "max_post_dilatation_mm", message: expect.stringContaining("must be at most nominal +") },
      { line: 4, message: "A line names a family (a balloon size) or a platform (a stent size), not both." },
      {
        line: 5,
        column: "compliance",
        message: "compliance: is for balloon lines; leave it empty on a stent line.",
      },
      { line: 6, column: "max_post_dilatation_mm", message: "max_post_dilatation_mm: is empty." },
      { line: 6, column: "in_stock", message: expect.stringContaining('"maybe" is not one of') },
    ]);
    expect(parseStockCsv("platform,diameter_mm\nP,3\n").issues[0]!.message).toMatch(
      /^Missing column max_post_dilatation_mm\./,
    );
  });
});

describe("planStockImport", () => {
  const plan = (lines: string[]) => {
    const parsed = parseStockCsv([HEADER, ...lines].join("\n"));
    expect(parsed.issues).toEqual([]);
    return planStockImport({ balloonFamilies: FAMILIES, stentPlatforms: PLATFORMS }, parsed);
  };

  it("adds a new platform with its sizes, changes a limit, removes an in_stock no size and leaves unlisted ones", () => {
    const { plan: p, issues } = plan([
      ",Stent platform X (illustrative),,3.00,yes,,,4.50", // unchanged
      ",stent platform x (illustrative),,3.50,,,,4.75", // limit changed, name matched without case
      ",Stent platform X (illustrative),,2.50,,,,3.50", // new size
      ",Stent platform Y (illustrative),,3.00,,,,4.00",
      ",Stent platform Y (illustrative),,3.50,no,,,4.50", // not stocked: never added
    ]);
    expect(issues).toEqual([]);
    expect(p.platformsToAdd).toEqual([{ name: "Stent platform Y (illustrative)", line: 5, sizes: 1 }]);
    expect(p.stentSizesToAdd).toEqual([
      { platform: "Stent platform X (illustrative)", platformId: 5, nominalMm: 2.5, maxPostDilatationMm: 3.5, line: 4 },
      {
        platform: "Stent platform Y (illustrative)",
        platformId: null,
        nominalMm: 3,
        maxPostDilatationMm: 4,
        line: 5,
      },
    ]);
    expect(p.stentSizesToChange).toEqual([
      expect.objectContaining({ id: 52, before: { maxPostDilatationMm: 4.5 }, after: { maxPostDilatationMm: 4.75 } }),
    ]);
    expect(p.stentSizesToRemove).toEqual([]);
    expect(p.unchangedStentSizes).toBe(1);
    expect(summarisePlan(p)).toBe("1 stent platform added, 2 stent sizes added, 1 stent size changed");
  });

  it("removes a size listed as not in stock, and plans balloons alongside", () => {
    const { plan: p } = plan([
      "NC family A (illustrative),,nc,3.25,yes,,,",
      ",Stent platform X (illustrative),,4.00,no,,,5.50",
    ]);
    expect(p.stentSizesToRemove).toEqual([
      { id: 53, platform: "Stent platform X (illustrative)", platformId: 5, nominalMm: 4, line: 3 },
    ]);
    expect(p.balloonsToAdd).toEqual([expect.objectContaining({ familyId: 1, diameterMm: 3.25 })]);
    expect(p.rowsInFile).toBe(2);
    expect(isEmptyPlan(p)).toBe(false);
  });

  it("refuses a nominal diameter listed twice for one platform", () => {
    const parsed = parseStockCsv(
      [HEADER, ",P (illustrative),,3.00,,,,4.00", ",p (illustrative),,3.00,,,,4.50"].join("\n"),
    );
    const { issues } = planStockImport({ balloonFamilies: [], stentPlatforms: [] }, parsed);
    expect(issues).toEqual([
      {
        line: 3,
        column: "diameter_mm",
        message: "diameter_mm: 3.00 mm is already listed for P (illustrative) on line 2.",
      },
    ]);
  });
});

describe("the example file the README ships", () => {
  it("parses without a problem and plans into an empty lab", async () => {
    const { readFile } = await import("node:fs/promises");
    const parsed = parseStockCsv(await readFile("public/examples/stock-example.csv", "utf8"));
    expect(parsed.issues).toEqual([]);
    const { plan: p, issues } = planStockImport({ balloonFamilies: [], stentPlatforms: [] }, parsed);
    expect(issues).toEqual([]);
    expect(p.familiesToAdd).toHaveLength(2);
    expect(p.platformsToAdd).toHaveLength(1);
    expect(p.stentSizesToAdd.length).toBeGreaterThan(0);
  });
});
