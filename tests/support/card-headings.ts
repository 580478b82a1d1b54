// The row and column headings a badge card prints, read back from the PDF by position: the words
// whose centres fall in the row-heading column and the column-heading row of each side's grid.
import { cardFaces, cardGrid, layoutCard } from "@/lib/poster/card";
import { snapshotGrids, type Snapshot } from "@/lib/charts/snapshot";
import { pdfWords, type PdfWord } from "./pdf-tools";

export type CardHeadings = { rows: string[]; cols: string[] };

/** Each face's headings; null for the key face (no grid). */
export function cardHeadings(pdf: Buffer, snapshot: Snapshot): (CardHeadings | null)[] {
  const grids = snapshotGrids(snapshot);
  const pages = pdfWords(pdf);
  return cardFaces(snapshot).map((side, i) => {
    if (side === "key") return null;
    const l = layoutCard(cardGrid(grids[side.lookup]!, side));
    const g = l.grid;
    const words = pages[i] ?? [];
    const centre = (w: PdfWord) => ({ x: (w.xMin + w.xMax) / 2, y: (w.yMin + w.yMax) / 2 });
    const cols = words
      .filter((w) => {
        const c = centre(w);
        return c.x > g.cellsX && c.x < l.qr.x && c.y > g.cellsY - g.colHeadHeight && c.y < g.cellsY;
      })
      .sort((a, b) => a.xMin - b.xMin);
    const rows = words
      .filter((w) => {
        const c = centre(w);
        return c.x > g.cellsX - g.rowHeadWidth && c.x < g.cellsX && c.y > g.cellsY && c.y < l.key.y;
      })
      .sort((a, b) => a.yMin - b.yMin);
    return { rows: rows.map((w) => w.text), cols: cols.map((w) => w.text) };
  });
}
