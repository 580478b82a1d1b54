// The lab's balloons as a CSV the import reads back unchanged: a starting point for editing.
import Papa from "papaparse";
import { REQUIRED_COLUMNS, OPTIONAL_COLUMNS } from "./csv";
import { formatMm } from "./format";
import type { BalloonFamilyView } from "./types";

/**
 * Cells a spreadsheet would run as a formula (OWASP "CSV Injection": a leading =, +, -, @, tab,
 * carriage return; and ;, a separator in some locales) get a leading apostrophe, shown as text;
 * the import (lib/stock/csv.ts) takes it off again, so the file still round-trips.
 */
export const FORMULA_START = /^[=+\-@\t\r;]/;

export function balloonStockCsv(families: BalloonFamilyView[]): string {
  const rows = families.flatMap((f) =>
    f.balloons.map((b) => [
      f.name,
      f.compliance,
      formatMm(b.diameterMm),
      b.inStock ? "yes" : "no",
      String(f.nominalAtm),
      String(f.rbpAtm),
      f.growthAtRbpMm === null ? "" : formatMm(f.growthAtRbpMm),
    ]),
  );
  return Papa.unparse(
    { fields: [...REQUIRED_COLUMNS, ...OPTIONAL_COLUMNS], data: rows },
    { newline: "\r\n", quotes: false, escapeFormulae: FORMULA_START },
  );
}
