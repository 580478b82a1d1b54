import { describe, expect, it } from "vitest";
import { parseBalloonCsv } from "@/lib/stock/csv";
import { balloonStockCsv } from "@/lib/stock/export";
import { isEmptyPlan, planBalloonImport, summarisePlan } from "@/lib/stock/import-plan";
import type { BalloonFamilyView } from "@/lib/stock/types";

const STOCK: BalloonFamilyView[] = [
  {
    id: 1,
    name: "NC family A (illustrative)",
    compliance: "nc",
    nominalAtm: 12,
    rbpAtm: 20,
    growthAtRbpMm: 0.2,
    balloons: [
      { id: 11, diameterMm: 2.5, inStock: true },
      { id: 12, diameterMm: 2.75, inStock: false },
      { id: 13, diameterMm: 3, inStock: true },
      { id: 14, diameterMm: 3.25, inStock: false },
    ],
  },
  {
    id: 2,
    name: "SC family B (illustrative)",
    compliance: "sc",
    nominalAtm: 8,
    rbpAtm: 14,
    growthAtRbpMm: null,
    balloons: [{ id: 21, diameterMm: 2, inStock: true }],
  },
];

const plan = (csv: string, stock = STOCK) => {
  const parsed = parseBalloonCsv(csv);
  expect(parsed.issues).toEqual([]);
  return planBalloonImport(stock, parsed.rows);
};

describe("planBalloonImport", () => {
  it("adds, changes and marks out of stock; families not in the file are left alone", () => {
    const { plan: p, issues } = plan(
      [
        "family;compliance;diameter_mm;in_stock",
        "nc family a (illustrative);nc;2,50;yes", // unchanged (name matched without case)
        "NC family A (illustrative);nc;2,75;yes", // out -> in
        "NC family A (illustrative);nc;3,50;no", // new size, out of stock
      ].join("\n"),
    );
    expect(issues).toEqual([]);
    expect(p.familiesToAdd).toEqual([]);
    expect(p.familiesToChange).toEqual([]);
    expect(p.balloonsToAdd).toEqual([
      { family: "NC family A (illustrative)", familyId: 1, diameterMm: 3.5, inStock: false, line: 4 },
    ]);
    expect(p.balloonsToChange).toEqual([
      {
        id: 12,
        family: "NC family A (illustrative)",
        familyId: 1,
        diameterMm: 2.75,
        before: { inStock: false },
        after: { inStock: true },
        line: 3,
      },
    ]);
    // 3.00 was in stock and is missing from the file; 3.25 is missing but already out.
    expect(p.balloonsToMarkOutOfStock).toEqual([
      { id: 13, family: "NC family A (illustrative)", familyId: 1, diameterMm: 3 },
    ]);
    expect(p.unchangedBalloons).toBe(2);
    expect(summarisePlan(p)).toBe("1 size added, 1 size changed, 1 size marked out of stock");
  });

  it("adds a new family with its sizes when the file gives its pressures on any line", () => {
    const { plan: p, issues } = plan(
      [
        "family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm,growth_at_rbp_mm",
        "New fam,sc,2.0,yes,,,",
        "New fam,sc,2.5,no,10,16,0.3",
      ].join("\n"),
    );
    expect(issues).toEqual([]);
    expect(p.familiesToAdd).toEqual([
      { name: "New fam", compliance: "sc", nominalAtm: 10, rbpAtm: 16, growthAtRbpMm: 0.3, line: 2, sizes: 2 },
    ]);
    expect(p.balloonsToAdd.map((b) => [b.familyId, b.diameterMm, b.inStock])).toEqual([
      [null, 2, true],
      [null, 2.5, false],
    ]);
  });

  it("refuses a new family without pressures, naming its first line and the missing columns", () => {
    const parsed = parseBalloonCsv(
      "family,compliance,diameter_mm,in_stock,nominal_atm\nX,nc,2.0,yes,\nX,nc,2.5,yes,12\n",
    );
    expect(planBalloonImport(STOCK, parsed.rows).issues).toEqual([
      { line: 2, message: "X is a new family: give its rbp_atm (on at least one of its lines)." },
    ]);
    const bare = parseBalloonCsv("family,compliance,diameter_mm,in_stock\nX,nc,2.0,yes\n");
    expect(planBalloonImport(STOCK, bare.rows).issues[0]!.message).toBe(
      "X is a new family: give its nominal_atm and rbp_atm (on at least one of its lines).",
    );
  });

  it("changes an existing family's values only where the file gives them", () => {
    const { plan: p } = plan(
      "family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm,growth_at_rbp_mm\nSC family B (illustrative),sc,2,yes,,15,0.25\n",
    );
    expect(p.familiesToChange).toEqual([
      {
        id: 2,
        name: "SC family B (illustrative)",
        before: {
          name: "SC family B (illustrative)",
          compliance: "sc",
          nominalAtm: 8,
          rbpAtm: 14,
          growthAtRbpMm: null,
        },
        after: { name: "SC family B (illustrative)", compliance: "sc", nominalAtm: 8, rbpAtm: 15, growthAtRbpMm: 0.25 },
        fields: ["rbpAtm", "growthAtRbpMm"],
      },
    ]);
  });

  it("checks a given pressure against the recorded one", () => {
    const parsed = parseBalloonCsv(
      "family,compliance,diameter_mm,in_stock,nominal_atm\nSC family B (illustrative),sc,2,yes,16\n",
    );
    expect(planBalloonImport(STOCK, parsed.rows).issues).toEqual([
      {
        line: 2,
        column: "nominal_atm",
        message:
          "SC family B (illustrative): the nominal pressure (16 atm) must be below the rated burst pressure (14 atm).",
      },
    ]);
  });

  it("refuses a diameter listed twice for a family and disagreeing family values, by line", () => {
    const parsed = parseBalloonCsv(
      [
        "family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm",
        "F,nc,2.5,yes,12,20",
        "F,nc,2.50,no,,",
        "F,sc,3,yes,,",
        "F,nc,3.5,yes,11,",
      ].join("\n"),
    );
    expect(planBalloonImport([], parsed.rows).issues).toEqual([
      { line: 3, column: "diameter_mm", message: "diameter_mm: 2.50 mm is already listed for F on line 2." },
      { line: 4, column: "compliance", message: 'compliance: "sc" differs from "nc" given for F on line 2.' },
      { line: 5, column: "nominal_atm", message: "nominal_atm: 11 differs from 12 given for F on line 2." },
    ]);
  });

  it("a file exported from the stock plans no change", () => {
    const { plan: p, issues } = plan(balloonStockCsv(STOCK));
    expect(issues).toEqual([]);
    expect(isEmptyPlan(p)).toBe(true);
    expect(summarisePlan(p)).toBe("no changes");
    expect(p.unchangedBalloons).toBe(5);
  });
});
