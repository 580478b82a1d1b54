// Reads a stock CSV (RFC 4180, comma, semicolon or tab, decimal point or comma) into checked
// balloon and stent rows, naming every bad line by its line number in the file (the header is line 1).
// A line naming a platform is a stent size; a line naming a family is a balloon size.
import Papa from "papaparse";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import {
  compliance,
  diameterMm,
  growthMm,
  pressureAtm,
  stentSizeInput,
  stockName,
  type Compliance,
} from "@/lib/validation/stock";
import { MAX_IMPORT_ROWS } from "./limits";
import { parseDecimalText } from "./format";

export const REQUIRED_COLUMNS = ["family", "compliance", "diameter_mm", "in_stock"] as const;
export const OPTIONAL_COLUMNS = ["nominal_atm", "rbp_atm", "growth_at_rbp_mm"] as const;
export const STENT_COLUMNS = ["platform", "diameter_mm", "max_post_dilatation_mm"] as const;
export type Column =
  (typeof REQUIRED_COLUMNS)[number] | (typeof OPTIONAL_COLUMNS)[number] | (typeof STENT_COLUMNS)[number];
const ALL_COLUMNS: readonly string[] = [...new Set([...REQUIRED_COLUMNS, ...OPTIONAL_COLUMNS, ...STENT_COLUMNS])];
const BALLOON_ONLY: readonly Column[] = ["family", "compliance", "nominal_atm", "rbp_atm", "growth_at_rbp_mm"];

/** What in_stock accepts, in any letter case. */
export const IN_STOCK_WORDS: Record<string, boolean> = {
  yes: true,
  y: true,
  true: true,
  "1": true,
  no: false,
  n: false,
  false: false,
  "0": false,
};

export type CsvRow = {
  line: number;
  family: string;
  compliance: Compliance;
  diameterMm: number;
  inStock: boolean;
  nominalAtm?: number;
  rbpAtm?: number;
  growthAtRbpMm?: number;
};

/** A stent size line: `in_stock` no removes the size (stent sizes have no stock flag). */
export type StentCsvRow = {
  line: number;
  platform: string;
  nominalMm: number;
  maxPostDilatationMm: number;
  inStock: boolean;
};

export type LineIssue = { line: number; column?: Column; message: string };

export type ParsedCsv = {
  delimiter: "," | ";" | "\t";
  columns: Column[];
  rows: CsvRow[];
  stentRows: StentCsvRow[];
  issues: LineIssue[];
};

// Built once: zod schemas are costly to construct and are reused for every line.
const familyName = stockName("Family");
const platformName = stockName("Platform");
const anyNumber = z.number();
const diameter = diameterMm();
const nominalPressure = pressureAtm("Nominal pressure");
const burstPressure = pressureAtm("Rated burst pressure");

const COLUMN_LIST = `${REQUIRED_COLUMNS.join(", ")} and optionally ${OPTIONAL_COLUMNS.join(", ")} for balloons; ${STENT_COLUMNS.join(", ")} for stents`;

/**
 * A header with a tab is a table pasted from a spreadsheet; one with a semicolon a semicolon
 * file (as spreadsheets write where the decimal mark is a comma).
 */
function detectDelimiter(text: string): "," | ";" | "\t" {
  const firstLine = text.slice(0, text.indexOf("\n") === -1 ? undefined : text.indexOf("\n"));
  return firstLine.includes("\t") ? "\t" : firstLine.includes(";") ? ";" : ",";
}

const firstMessage = (result: z.ZodSafeParseResult<unknown>) =>
  result.success ? "" : (result.error.issues[0]?.message ?? "is not valid.");

export function parseStockCsv(input: string): ParsedCsv {
  const text = input.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  const delimiter = detectDelimiter(text);
  const issues: LineIssue[] = [];
  const rows: CsvRow[] = [];
  const stentRows: StentCsvRow[] = [];
  let columns: Column[] | null = null;
  let headerBroken = false;
  let dataRows = 0;
  let tooMany = false;
  let consumed = 0;
  let line = 1;

  Papa.parse<string[]>(text, {
    delimiter,
    newline: "\n",
    quoteChar: '"',
    escapeChar: '"',
    step: (result, parser) => {
      const start = line;
      const end = result.meta.cursor;
      line += (text.slice(consumed, end).match(/\n/g) ?? []).length;
      consumed = end;
      const fields = result.data;
      if (fields.every((f) => f.trim() === "")) return;

      for (const err of result.errors) {
        issues.push({
          line: start,
          message:
            err.code === "MissingQuotes"
              ? 'A quoted field is never closed: a closing " is missing (everything after it was read as one field).'
              : err.code === "InvalidQuotes"
                ? 'A quoted field has characters after its closing quote; inside quotes write a quote as "".'
                : err.message,
        });
      }
      if (result.errors.length) {
        if (!columns) [columns, headerBroken] = [[], true];
        return;
      }

      if (!columns) {
        columns = readHeader(fields, start, issues);
        headerBroken = columns === null;
        columns ??= [];
        return;
      }
      if (headerBroken) return;
      dataRows += 1;
      if (dataRows > MAX_IMPORT_ROWS) {
        tooMany = true;
        parser.abort();
        return;
      }
      const row = readRow(fields, columns, delimiter, start, issues);
      if (row && "platform" in row) stentRows.push(row);
      else if (row) rows.push(row);
    },
  });

  if (tooMany)
    throw new AppError(
      "payload_too_large",
      `The file has more than ${MAX_IMPORT_ROWS.toLocaleString("en")} rows; the limit is ${MAX_IMPORT_ROWS.toLocaleString("en")}. Split it into smaller files.`,
    );
  if (columns === null)
    issues.push({
      line: 1,
      message: `The file has no header line. The first line must name the columns: ${COLUMN_LIST}.`,
    });
  else if (!headerBroken && dataRows === 0)
    issues.push({ line: 2, message: "The file has a header but no stock lines." });
  return { delimiter, columns: columns ?? [], rows, stentRows, issues };
}

/** The balloon-only reader the first import shipped with: same parser, any stent lines included. */
export const parseBalloonCsv = parseStockCsv;

function readHeader(fields: string[], line: number, issues: LineIssue[]): Column[] | null {
  const names = fields.map((f) => f.trim().toLowerCase());
  const before = issues.length;
  names.forEach((name, i) => {
    if (name === "" && i === names.length - 1) return;
    if (!ALL_COLUMNS.includes(name))
      issues.push({ line, message: `Unknown column "${fields[i]!.trim()}". The columns are ${COLUMN_LIST}.` });
    else if (names.indexOf(name) !== i) issues.push({ line, message: `The column "${name}" appears twice.` });
  });
  // A file with stent columns may hold stents only; balloon lines then need the balloon columns.
  const stents = names.includes("platform") || names.includes("max_post_dilatation_mm");
  const required: readonly Column[] = stents
    ? [...STENT_COLUMNS, ...(names.includes("family") ? REQUIRED_COLUMNS : [])]
    : REQUIRED_COLUMNS;
  const missing = [...new Set(required)].filter((c) => !names.includes(c));
  if (missing.length)
    issues.push({
      line,
      message: `Missing column${missing.length > 1 ? "s" : ""} ${missing.join(", ")}. The columns are ${COLUMN_LIST}.`,
    });
  return issues.length > before ? null : (names.filter((n) => n !== "") as Column[]);
}

type Read = {
  line: number;
  value: (c: Column) => string;
  fail: (column: Column, message: string) => void;
  issues: LineIssue[];
};

function readRow(
  fields: string[],
  columns: Column[],
  delimiter: string,
  line: number,
  issues: LineIssue[],
): CsvRow | StentCsvRow | null {
  const extra = fields.slice(columns.length);
  const needed: readonly string[] = [...REQUIRED_COLUMNS, ...STENT_COLUMNS];
  // Missing trailing optional fields read as empty; a missing required one or extra content is an error.
  const missingRequired = columns.slice(fields.length).some((c) => needed.includes(c));
  if (missingRequired || extra.some((f) => f.trim() !== "")) {
    const hint =
      delimiter === "," && fields.length > columns.length
        ? ' A decimal comma in a comma-separated file must be quoted ("2,75"), or use a decimal point (2.75).'
        : "";
    issues.push({
      line,
      message: `This line has ${fields.length} fields but the header has ${columns.length}.${hint}`,
    });
    return null;
  }
  const value = (c: Column) => {
    const i = columns.indexOf(c);
    return i === -1 ? "" : (fields[i] ?? "").trim();
  };
  const fail = (column: Column, message: string) => issues.push({ line, column, message: `${column}: ${message}` });
  const read: Read = { line, value, fail, issues };
  if (!columns.includes("platform")) return readBalloonRow(read);
  const [platform, family] = [value("platform"), value("family")];
  if (platform && family) {
    issues.push({ line, message: "A line names a family (a balloon size) or a platform (a stent size), not both." });
    return null;
  }
  if (platform || !columns.includes("family")) return readStentRow(read);
  return readBalloonRow(read);
}

function readStentRow({ line, value, fail, issues }: Read): StentCsvRow | null {
  const before = issues.length;
  for (const c of BALLOON_ONLY) if (value(c) !== "") fail(c, "is for balloon lines; leave it empty on a stent line.");
  const name = platformName.safeParse(value("platform").replace(/^'(?=[=+\-@\t\r;])/, ""));
  if (!name.success) fail("platform", value("platform") === "" ? "is empty." : firstMessage(name));
  const nominal = number(value("diameter_mm"), "diameter_mm", true, (n) => diameter.safeParse(n), fail);
  const maxPost = number(
    value("max_post_dilatation_mm"),
    "max_post_dilatation_mm",
    true,
    (n) => anyNumber.safeParse(n),
    fail,
  );
  const rawStock = value("in_stock").toLowerCase();
  const stock = rawStock === "" ? true : IN_STOCK_WORDS[rawStock];
  if (stock === undefined) fail("in_stock", `"${value("in_stock")}" is not one of yes, no, y, n, true, false, 1, 0.`);
  if (nominal !== undefined && maxPost !== undefined) {
    const size = stentSizeInput.safeParse({ nominalMm: nominal, maxPostDilatationMm: maxPost });
    if (!size.success) fail("max_post_dilatation_mm", firstMessage(size));
    else if (issues.length === before && name.success && stock !== undefined)
      return { line, platform: name.data, ...size.data, inStock: stock };
  }
  return null;
}

function readBalloonRow({ line, value, fail, issues }: Read): CsvRow | null {
  const before = issues.length;
  if (value("max_post_dilatation_mm") !== "")
    fail("max_post_dilatation_mm", "is for stent lines; leave it empty on a balloon line.");

  // Our own export writes '=... for a name starting like a formula (lib/stock/export.ts).
  const family = familyName.safeParse(value("family").replace(/^'(?=[=+\-@\t\r;])/, ""));
  if (!family.success) fail("family", value("family") === "" ? "is empty." : firstMessage(family));

  const rawCompliance = value("compliance").toLowerCase();
  const comp = compliance.safeParse(rawCompliance);
  if (!comp.success)
    fail(
      "compliance",
      rawCompliance === ""
        ? 'is empty: write "nc" (non-compliant) or "sc" (semi-compliant).'
        : `"${value("compliance")}" is not "nc" or "sc".`,
    );

  const diameterValue = number(value("diameter_mm"), "diameter_mm", true, (n) => diameter.safeParse(n), fail);

  const rawStock = value("in_stock").toLowerCase();
  const stock = IN_STOCK_WORDS[rawStock];
  if (stock === undefined) {
    fail(
      "in_stock",
      rawStock === ""
        ? "is empty: write yes or no."
        : `"${value("in_stock")}" is not one of yes, no, y, n, true, false, 1, 0.`,
    );
  }

  const nominal = number(value("nominal_atm"), "nominal_atm", false, (n) => nominalPressure.safeParse(n), fail);
  const rbp = number(value("rbp_atm"), "rbp_atm", false, (n) => burstPressure.safeParse(n), fail);
  const growth = number(value("growth_at_rbp_mm"), "growth_at_rbp_mm", false, (n) => growthMm.safeParse(n), fail);
  if (nominal !== undefined && rbp !== undefined && nominal >= rbp)
    fail("rbp_atm", `the rated burst pressure (${rbp} atm) must be above the nominal pressure (${nominal} atm).`);

  if (issues.length > before || !family.success || !comp.success || diameterValue === undefined || stock === undefined)
    return null;
  return {
    line,
    family: family.data,
    compliance: comp.data,
    diameterMm: diameterValue,
    inStock: stock,
    ...(nominal !== undefined ? { nominalAtm: nominal } : {}),
    ...(rbp !== undefined ? { rbpAtm: rbp } : {}),
    ...(growth !== undefined ? { growthAtRbpMm: growth } : {}),
  };
}

function number(
  raw: string,
  column: Column,
  required: boolean,
  check: (n: number) => z.ZodSafeParseResult<number>,
  fail: (column: Column, message: string) => void,
): number | undefined {
  const n = parseDecimalText(raw);
  if (n === undefined) {
    if (required) fail(column, "is empty.");
    return undefined;
  }
  if (Number.isNaN(n)) {
    fail(column, `"${raw}" is not a number (write it like 2.75 or 2,75).`);
    return undefined;
  }
  const result = check(n);
  if (!result.success) {
    fail(column, firstMessage(result));
    return undefined;
  }
  return result.data;
}

const ISSUES_LISTED = 200;

/** Bad lines -> one 400 naming each line (the first 200) and column; nothing is imported. */
export function csvIssuesError(issues: LineIssue[]): AppError {
  const lines = new Set(issues.map((i) => i.line)).size;
  const listed = issues
    .slice(0, ISSUES_LISTED)
    .map((i) => ({ path: ["line", i.line, ...(i.column ? [i.column] : [])], message: `Line ${i.line}: ${i.message}` }));
  const more = issues.length > ISSUES_LISTED ? ` The first ${ISSUES_LISTED} problems are listed.` : "";
  return new AppError(
    "invalid_input",
    `${lines === 1 ? "1 line has a problem" : `${lines} lines have problems`}; nothing was imported. Correct the file and try again.${more}`,
    listed,
  );
}
