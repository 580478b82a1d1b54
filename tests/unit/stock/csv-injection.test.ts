import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { parseBalloonCsv } from "@/lib/stock/csv";
import { balloonStockCsv } from "@/lib/stock/export";
import type { BalloonFamilyView } from "@/lib/stock/types";

// Names a spreadsheet would run as formulas (OWASP "CSV Injection") are exported as text.
const NAMES = [
  '=HYPERLINK("http://x.example","y")',
  "+cmd|' /C calc'!A0",
  "-1+1",
  "@SUM(1+1)*cmd|' /C calc'!A0",
  ";=1+1 split",
  "Plain NC 2",
];

function family(name: string, id: number): BalloonFamilyView {
  return {
    id,
    name,
    compliance: "nc",
    nominalAtm: 12,
    rbpAtm: 20,
    growthAtRbpMm: null,
    balloons: [{ id: id * 10, diameterMm: 3, inStock: true }],
  } as unknown as BalloonFamilyView;
}

describe("stock CSV export and formula injection", () => {
  const csv = balloonStockCsv(NAMES.map((n, i) => family(n, i + 1)));
  const cells = Papa.parse<string[]>(csv.trim())
    .data.slice(1)
    .map((r) => r[0]!);

  it("prefixes every cell that starts with =, +, -, @ or ; with an apostrophe, and leaves others alone", () => {
    expect(cells).toEqual(NAMES.map((n) => (/^[=+\-@;]/.test(n) ? `'${n}` : n)));
    for (const c of cells) expect(c).not.toMatch(/^[=+\-@\t\r;]/);
  });

  it("reads its own export back to the original names", () => {
    const parsed = parseBalloonCsv(csv);
    expect(parsed.issues).toEqual([]);
    expect(parsed.rows.map((r) => r.family)).toEqual(NAMES);
  });
});
