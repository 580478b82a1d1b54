// Per-page text of a PDF as poppler reads it.
import { execFileSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import path from "node:path";
import { withTempDir } from "./pdf-tools";

/**
 * pdftotext per page, as an operator's copy-paste would read each sheet: in layout order, or
 * `raw` in the order drawn (a tiled sheet's clipped-off poster text can split a layout line).
 */
export function pageTexts(pdf: Buffer, order: "layout" | "raw" = "layout"): string[] {
  return withTempDir((dir) => {
    const file = path.join(dir, "v.pdf");
    writeFileSync(file, pdf);
    const out = execFileSync("pdftotext", [`-${order}`, file, "-"], { encoding: "utf8" });
    return out.split("\f").slice(0, -1);
  });
}
