import { describe, expect, it } from "vitest";
import { describeStockChange } from "@/lib/stock/history";

describe("describeStockChange", () => {
  it("lists only the changed fields of an update, formatted with units", () => {
    const rows = describeStockChange("stock.family.update", {
      before: { name: "F", compliance: "nc", nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: null },
      after: { name: "F", compliance: "nc", nominalAtm: 12.5, rbpAtm: 20, growthAtRbpMm: 0.2 },
    });
    expect(rows).toEqual([
      { label: "Nominal pressure", before: "12 atm", after: "12.5 atm" },
      { label: "Growth at rated burst pressure", before: "not recorded", after: "0.20 mm" },
    ]);
  });

  it("lists every field of a created or deleted thing", () => {
    expect(
      describeStockChange("stock.balloon.create", {
        before: null,
        after: { family: "F", diameterMm: 3.25, inStock: false },
      }),
    ).toEqual([
      { label: "Family", before: "—", after: "F" },
      { label: "Diameter", before: "—", after: "3.25 mm" },
      { label: "In stock", before: "—", after: "out of stock" },
    ]);
    const deleted = describeStockChange("stock.platform.delete", {
      before: { name: "P", sizes: [{ nominalMm: 3, maxPostDilatationMm: 4.5 }] },
      after: null,
    });
    expect(deleted).toContainEqual({ label: "Sizes", before: "1: 3.00 (to 4.50)", after: "—" });
  });

  it("turns an import's family snapshots into per-size rows", () => {
    const rows = describeStockChange("stock.import", {
      before: {
        families: [
          {
            name: "A",
            compliance: "nc",
            nominalAtm: 12,
            rbpAtm: 20,
            growthAtRbpMm: null,
            balloons: [
              { diameterMm: 2.5, inStock: true },
              { diameterMm: 3, inStock: true },
            ],
          },
        ],
      },
      after: {
        families: [
          {
            name: "A",
            compliance: "nc",
            nominalAtm: 12,
            rbpAtm: 20,
            growthAtRbpMm: null,
            balloons: [
              { diameterMm: 2.5, inStock: true },
              { diameterMm: 3, inStock: false },
              { diameterMm: 3.5, inStock: true },
            ],
          },
          {
            name: "B",
            compliance: "sc",
            nominalAtm: 8,
            rbpAtm: 14,
            growthAtRbpMm: null,
            balloons: [{ diameterMm: 2, inStock: true }],
          },
        ],
      },
    });
    expect(rows).toEqual([
      { label: "A 3.00 mm", before: "in stock", after: "out of stock" },
      { label: "A 3.50 mm", before: "—", after: "in stock" },
      {
        label: "B",
        before: "—",
        after:
          "new family: compliance sc, nominal pressure 8 atm, rated burst pressure 14 atm, growth at rated burst pressure not recorded",
      },
      { label: "B 2.00 mm", before: "—", after: "in stock" },
    ]);
  });

  it("shrugs at detail it does not know", () => {
    expect(describeStockChange("stock.family.update", null)).toEqual([]);
  });
});
