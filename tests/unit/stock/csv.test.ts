import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { IN_STOCK_WORDS, parseBalloonCsv } from "@/lib/stock/csv";
import { MAX_IMPORT_ROWS } from "@/lib/stock/limits";

const HEADER = "family,compliance,diameter_mm,in_stock";
const FULL = "family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm,growth_at_rbp_mm";

describe("parseBalloonCsv: RFC 4180", () => {
  it("reads plain comma-separated rows with LF line ends", () => {
    const out = parseBalloonCsv(`${HEADER}\nFam,nc,2.5,yes\nFam,nc,3,no\n`);
    expect(out.issues).toEqual([]);
    expect(out.delimiter).toBe(",");
    expect(out.rows).toEqual([
      { line: 2, family: "Fam", compliance: "nc", diameterMm: 2.5, inStock: true },
      { line: 3, family: "Fam", compliance: "nc", diameterMm: 3, inStock: false },
    ]);
  });

  it("reads CRLF line ends and a missing final line break", () => {
    const out = parseBalloonCsv(`${HEADER}\r\nFam,nc,2.5,yes\r\nFam,sc,3.25,no`);
    expect(out.issues).toEqual([]);
    expect(out.rows.map((r) => [r.line, r.compliance, r.diameterMm])).toEqual([
      [2, "nc", 2.5],
      [3, "sc", 3.25],
    ]);
  });

  it("reads quoted fields, escaped quotes and embedded separators", () => {
    const out = parseBalloonCsv(`${HEADER}\n"Family ""Q"", long",nc,"2.50","yes"\n`);
    expect(out.issues).toEqual([]);
    expect(out.rows[0]).toMatchObject({ family: 'Family "Q", long', diameterMm: 2.5, inStock: true });
  });

  it("counts physical lines when a quoted field holds a line break, and rejects the break in a name", () => {
    const out = parseBalloonCsv(`${HEADER}\n"Two\nlines",nc,2.5,yes\nFam,nc,9,yes\n`);
    expect(out.rows).toEqual([]);
    expect(out.issues).toEqual([
      { line: 2, column: "family", message: "family: Family name cannot contain line breaks or control characters." },
      { line: 4, column: "diameter_mm", message: "diameter_mm: Diameter must be at most 7.00 mm." },
    ]);
  });

  it("a record spanning two lines keeps its first line number, and the next record counts both", () => {
    const out = parseBalloonCsv(`${HEADER}\r\nFam,nc,"2.5","yes\r\n"\r\nFam,nc,3,"no"\r\n`);
    expect(out.issues).toEqual([]);
    expect(out.rows.map((r) => [r.line, r.inStock])).toEqual([
      [2, true],
      [4, false],
    ]);
  });

  it("reports an unterminated quote on the line where the record starts", () => {
    const out = parseBalloonCsv(`${HEADER}\nFam,nc,2.5,yes\n"Fam,nc,3,yes\nFam,nc,3.5,yes\n`);
    expect(out.issues).toHaveLength(1);
    expect(out.issues[0]!.line).toBe(3);
    expect(out.issues[0]!.message).toMatch(/closing " is missing/);
  });

  it("skips blank lines but keeps counting them", () => {
    const out = parseBalloonCsv(`${HEADER}\n\nFam,nc,2.5,yes\n,,,\n   \nFam,nc,zz,yes\n`);
    expect(out.rows.map((r) => r.line)).toEqual([3]);
    expect(out.issues).toEqual([
      { line: 6, column: "diameter_mm", message: 'diameter_mm: "zz" is not a number (write it like 2.75 or 2,75).' },
    ]);
  });
});

describe("parseBalloonCsv: separators, decimal commas, BOM", () => {
  it("detects a semicolon file and reads decimal commas in it", () => {
    const out = parseBalloonCsv(
      "family;compliance;diameter_mm;in_stock;nominal_atm;rbp_atm;growth_at_rbp_mm\nFam;nc;2,75;ja;12;20;0,2\nFam;nc;3,00;yes;;;\n".replace(
        "ja",
        "yes",
      ),
    );
    expect(out.delimiter).toBe(";");
    expect(out.issues).toEqual([]);
    expect(out.rows[0]).toMatchObject({ diameterMm: 2.75, nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: 0.2 });
    expect(out.rows[1]).toEqual({ line: 3, family: "Fam", compliance: "nc", diameterMm: 3, inStock: true });
  });

  it("reads a quoted decimal comma in a comma file", () => {
    const out = parseBalloonCsv(`${FULL}\nFam,nc,"2,75",yes,"12,5","20,0","0,15"\n`);
    expect(out.issues).toEqual([]);
    expect(out.rows[0]).toMatchObject({ diameterMm: 2.75, nominalAtm: 12.5, rbpAtm: 20, growthAtRbpMm: 0.15 });
  });

  it("explains an unquoted decimal comma in a comma file", () => {
    const out = parseBalloonCsv(`${HEADER}\nFam,nc,2,75,yes\n`);
    expect(out.issues).toEqual([
      {
        line: 2,
        message:
          'This line has 5 fields but the header has 4. A decimal comma in a comma-separated file must be quoted ("2,75"), or use a decimal point (2.75).',
      },
    ]);
  });

  it("reads a decimal point in a semicolon file too", () => {
    expect(parseBalloonCsv("family;compliance;diameter_mm;in_stock\nFam;sc;3.5;no\n").rows[0]).toMatchObject({
      diameterMm: 3.5,
      inStock: false,
    });
  });

  it("ignores a UTF-8 byte-order mark and header case and spacing", () => {
    const out = parseBalloonCsv(`\uFEFF Family , COMPLIANCE,Diameter_MM,in_stock\nFam,NC,2.5,YES\n`);
    expect(out.issues).toEqual([]);
    expect(out.rows[0]).toMatchObject({ compliance: "nc", inStock: true });
  });

  it("tolerates a trailing empty column a spreadsheet adds", () => {
    const out = parseBalloonCsv("family;compliance;diameter_mm;in_stock;\nFam;nc;2,5;yes;\n");
    expect(out.issues).toEqual([]);
    expect(out.rows).toHaveLength(1);
  });
});

describe("parseBalloonCsv: in_stock", () => {
  it.each(Object.entries(IN_STOCK_WORDS))("%s means %s", (word, value) => {
    for (const spelling of [word, word.toUpperCase(), ` ${word} `]) {
      const out = parseBalloonCsv(`${HEADER}\nFam,nc,2.5,${spelling}\n`);
      expect(out.issues).toEqual([]);
      expect(out.rows[0]!.inStock).toBe(value);
    }
  });

  it("refuses other words and empty values", () => {
    const out = parseBalloonCsv(`${HEADER}\nFam,nc,2.5,maybe\nFam,nc,3,\n`);
    expect(out.issues).toEqual([
      { line: 2, column: "in_stock", message: 'in_stock: "maybe" is not one of yes, no, y, n, true, false, 1, 0.' },
      { line: 3, column: "in_stock", message: "in_stock: is empty: write yes or no." },
    ]);
  });
});

describe("parseBalloonCsv: every bad-line reason with its line number", () => {
  const cases: [string, string, { line: number; column?: string; message: string }][] = [
    ["empty family", ",nc,2.5,yes", { line: 2, column: "family", message: "family: is empty." }],
    [
      "family too long",
      `${"x".repeat(121)},nc,2.5,yes`,
      { line: 2, column: "family", message: "family: Family name must be 120 characters or fewer." },
    ],
    [
      "bad compliance",
      "Fam,xx,2.5,yes",
      { line: 2, column: "compliance", message: 'compliance: "xx" is not "nc" or "sc".' },
    ],
    [
      "empty compliance",
      "Fam,,2.5,yes",
      {
        line: 2,
        column: "compliance",
        message: 'compliance: is empty: write "nc" (non-compliant) or "sc" (semi-compliant).',
      },
    ],
    ["empty diameter", "Fam,nc,,yes", { line: 2, column: "diameter_mm", message: "diameter_mm: is empty." }],
    [
      "diameter not a number",
      "Fam,nc,2.5mm,yes",
      { line: 2, column: "diameter_mm", message: 'diameter_mm: "2.5mm" is not a number (write it like 2.75 or 2,75).' },
    ],
    [
      "diameter too small",
      "Fam,nc,0.95,yes",
      { line: 2, column: "diameter_mm", message: "diameter_mm: Diameter must be at least 1.00 mm." },
    ],
    [
      "diameter too large",
      "Fam,nc,7.05,yes",
      { line: 2, column: "diameter_mm", message: "diameter_mm: Diameter must be at most 7.00 mm." },
    ],
    [
      "diameter off the grid",
      "Fam,nc,2.33,yes",
      {
        line: 2,
        column: "diameter_mm",
        message: "diameter_mm: Diameter must be a multiple of 0.05 mm (for example 2.25 or 2.30).",
      },
    ],
    [
      "pressure too high",
      "Fam,nc,2.5,yes,12,41,",
      { line: 2, column: "rbp_atm", message: "rbp_atm: Rated burst pressure must be at most 40 atm." },
    ],
    [
      "pressure below 1",
      "Fam,nc,2.5,yes,0.5,20,",
      { line: 2, column: "nominal_atm", message: "nominal_atm: Nominal pressure must be at least 1 atm." },
    ],
    [
      "pressure off its 0.1 grid",
      "Fam,nc,2.5,yes,12.25,20,",
      { line: 2, column: "nominal_atm", message: "nominal_atm: Nominal pressure must be given in steps of 0.1 atm." },
    ],
    [
      "nominal not below burst",
      "Fam,nc,2.5,yes,20,20,",
      {
        line: 2,
        column: "rbp_atm",
        message: "rbp_atm: the rated burst pressure (20 atm) must be above the nominal pressure (20 atm).",
      },
    ],
    [
      "growth above 1 mm",
      "Fam,nc,2.5,yes,12,20,1.5",
      {
        line: 2,
        column: "growth_at_rbp_mm",
        message: "growth_at_rbp_mm: Growth at rated burst pressure must be at most 1.00 mm.",
      },
    ],
    ["too few fields", "Fam,nc,2.5", { line: 2, message: "This line has 3 fields but the header has 7." }],
  ];
  it.each(cases)("%s", (_name, line, issue) => {
    const out = parseBalloonCsv(`${FULL}\n${line}\n`);
    expect(out.rows).toEqual([]);
    expect(out.issues).toEqual([issue]);
  });

  it("reports several problems on one line and keeps the good lines", () => {
    const out = parseBalloonCsv(`${HEADER}\nFam,nc,2.5,yes\nFam,zz,9,maybe\nFam,nc,3,no\n`);
    expect(out.rows.map((r) => r.line)).toEqual([2, 4]);
    expect(out.issues.map((i) => [i.line, i.column])).toEqual([
      [3, "compliance"],
      [3, "diameter_mm"],
      [3, "in_stock"],
    ]);
  });
});

describe("parseBalloonCsv: header", () => {
  it("names missing columns on line 1", () => {
    expect(parseBalloonCsv("family,diameter_mm\nFam,2.5\n").issues).toEqual([
      {
        line: 1,
        message:
          "Missing columns compliance, in_stock. The columns are family, compliance, diameter_mm, in_stock and optionally nominal_atm, rbp_atm, growth_at_rbp_mm for balloons; platform, diameter_mm, max_post_dilatation_mm for stents.",
      },
    ]);
  });

  it("refuses unknown and repeated columns rather than dropping data", () => {
    const out = parseBalloonCsv(`${HEADER},nominal_pressure,in_stock\nFam,nc,2.5,yes,12,yes\n`);
    expect(out.rows).toEqual([]);
    expect(out.issues.map((i) => i.message)).toEqual([
      expect.stringContaining('Unknown column "nominal_pressure"'),
      'The column "in_stock" appears twice.',
    ]);
    expect(out.issues.every((i) => i.line === 1)).toBe(true);
  });

  it("says so when there are no lines after the header, or nothing at all", () => {
    expect(parseBalloonCsv(`${HEADER}\n`).issues).toEqual([
      { line: 2, message: "The file has a header but no stock lines." },
    ]);
    expect(parseBalloonCsv("\n\n").issues[0]).toMatchObject({
      line: 1,
      message: expect.stringContaining("no header line"),
    });
  });
});

describe("parseBalloonCsv: row limit", () => {
  const file = (rows: number) =>
    [
      HEADER,
      ...Array.from({ length: rows }, (_, i) => `F${Math.floor(i / 100)},nc,${(1 + (i % 100) * 0.05).toFixed(2)},yes`),
    ].join("\n");

  it(`reads exactly ${MAX_IMPORT_ROWS} rows`, () => {
    const out = parseBalloonCsv(file(MAX_IMPORT_ROWS));
    expect(out.issues).toEqual([]);
    expect(out.rows).toHaveLength(MAX_IMPORT_ROWS);
    expect(out.rows.at(-1)!.line).toBe(MAX_IMPORT_ROWS + 1);
  });

  it(`refuses ${MAX_IMPORT_ROWS + 1} rows with a 413`, () => {
    let caught: unknown;
    try {
      parseBalloonCsv(file(MAX_IMPORT_ROWS + 1));
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(AppError);
    expect((caught as AppError).status).toBe(413);
    expect((caught as AppError).message).toContain("more than 5,000 rows");
  });
});
