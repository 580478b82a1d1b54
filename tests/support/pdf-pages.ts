// Per-page text of a PDF as poppler reads it.
import { execFileSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import path from "node:path";
import { withTempDir } from "./pdf-tools";

/** pdftotext per page (layout order), as an operator's copy-paste would read each sheet. */
export function pageTexts(pdf: Buffer): string[] {
  return withTempDir((dir) => {
    const file = path.join(dir, "v.pdf");
    writeFileSync(file, pdf);
    const out = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
    return out.split("\f").slice(0, -1);
  });
}
