// Where every cell's words land, read back with poppler's pdftotext -bbox: the large figure
// centred in its cell, the exact diameter at the cell's top-left inset and the mark symbols at its
// top-right inset, all within the cell. The cell words are drawn by one layer per grid, apart from
// react-pdf's text layout, so this holds that layer to the grid it writes into.
import { beforeAll, describe, expect, it } from "vitest";
import { posterModel, type PosterInput } from "@/lib/poster/pdf/document";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import { cellBox, CELL, type Box } from "@/lib/poster/layout";
import { cellView, cornerSymbols } from "@/lib/poster/marks";
import { pdfWords, type PdfWord } from "@/tests/support/pdf-tools";
import { kissingDefinition, posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const reach = { ...potDefinition, lookups: [{ ...potDefinition.lookups[0], rounding: "reach" as const }] };

/** A word of the cell: its box within the cell's width, its middle within the cell's height (poppler's
 * word box runs from the font's ascent to its descent, which may pass a tight cell's bottom rule). */
const inCell = (w: PdfWord, b: Box) =>
  w.xMin >= b.x && w.xMax <= b.x + b.width && (w.yMin + w.yMax) / 2 > b.y && (w.yMin + w.yMax) / 2 < b.y + b.height;

describe.each([
  ["POT, rounded up", posterInput(snapshotOf(potDefinition))],
  // Approved, so the draft watermark does not cross the cells.
  ["kissing, rounded down", posterInput(snapshotOf(kissingDefinition))],
  ["POT, pushed to reach (pressure lines)", posterInput(snapshotOf(reach))],
] as [string, PosterInput][])("cell words on the %s poster", (_name, input) => {
  let words: PdfWord[] = [];
  const { grids, layout } = posterModel(input);
  beforeAll(async () => {
    words = pdfWords(await renderPosterPdf(input))[0] ?? [];
  });

  it("centres each cell's large figure and insets its small lines, within the cell", () => {
    const f = layout.figurePt;
    let checked = 0;
    grids.forEach((grid, gi) => {
      const g = layout.grids[gi]!;
      grid.cells.forEach((row, i) =>
        row.forEach((cell, j) => {
          const box = cellBox(g, i, j);
          const view = cellView(cell);
          const mine = words.filter((w) => inCell(w, box));
          // The large figure: the word in the cell at the figure's size (poppler's box is the font's ascent to descent).
          const big = mine.filter((w) => w.yMax - w.yMin > f);
          expect(big.map((w) => w.text)).toEqual([view.primary]);
          const figure = big[0]!;
          expect(Math.abs((figure.xMin + figure.xMax) / 2 - (box.x + box.width / 2))).toBeLessThan(0.05);
          const inset = f * 0.1 + view.border * Math.min(box.width, box.height);
          if (view.exact) {
            const exact = mine.find((w) => w.text === view.exact);
            expect(exact, `exact diameter in cell ${i},${j}`).toBeDefined();
            expect(Math.abs(exact!.xMin - (box.x + inset))).toBeLessThan(0.05);
            expect(exact!.yMax).toBeLessThan(figure.yMax);
          }
          const corner = cornerSymbols(view);
          if (corner) {
            const marks = mine.find((w) => w.text === corner);
            expect(marks, `marks in cell ${i},${j}`).toBeDefined();
            expect(Math.abs(marks!.xMax - (box.x + box.width - inset))).toBeLessThan(0.05);
          }
          if (grid.rounding === "reach" && view.pressure) {
            const atm = mine.filter((w) => w.yMin > figure.yMin && w.yMax - w.yMin < f * CELL.smallRatio * 1.5);
            expect(atm.map((w) => w.text).join(" ")).toBe(view.pressure);
          }
          checked++;
        }),
      );
    });
    expect(checked).toBeGreaterThan(40);
  });
});
