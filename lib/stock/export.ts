// The lab's balloons as a CSV the import reads back unchanged: a starting point for editing.
import Papa from "papaparse";
import { REQUIRED_COLUMNS, OPTIONAL_COLUMNS } from "./csv";
import { formatMm } from "./format";
import type { BalloonFamilyView } from "./types";

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
    { newline: "\r\n", quotes: false },
  );
}
