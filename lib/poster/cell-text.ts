import type { NumberFormat } from "@/lib/format/numbers";
import type { Grid } from "@/lib/sizing";
import { localiseNumbers } from "./labels";
import { cellBox, CELL, type Box, type GridFrame } from "./layout";
import { cellView, cornerSymbols, formatAxisMm, type CellView } from "./marks";

/** One line of words in a cell or grid heading: where it goes on the page, in which weight and size. */
export type TextRun = {
  text: string;
  weight: 400 | 700;
  /** Font size, pt. */
  size: number;
  /** Left edge of the line, or of the span it is aligned in, pt from the page's left. */
  x: number;
  /** Top of the line box, pt from the page's top; the baseline sits one font ascent below. */
  y: number;
  /** Width of the span the line is centred or right-aligned in. */
  align?: { width: number; to: "center" | "right" };
  /** Tabular figures, so digits line up from cell to cell. */
  tnum: boolean;
};

/**
 * A cell to be worded: its marks, its box on the page, and the figure size of its grid; `exact`
 * false leaves the exact diameter out (the badge card, where it would be too small to read).
 */
export type WordedCell = { view: CellView; box: Box; f: number; pressureLine: boolean; exact?: boolean };

/**
 * The words of one cell (its background, hatching, rule and border are drawn apart): the exact
 * diameter small at the top left, the mark symbols small at the top right, the printed balloon
 * large in the middle, and the pressure line under it in grids that can push a balloon.
 */
export function cellTextRuns(
  { view, box, f, pressureLine, exact = true }: WordedCell,
  nf: NumberFormat = "point",
): TextRun[] {
  const small = f * CELL.smallRatio;
  // Cells stretched to fill the page keep the figure in their middle.
  const lift = Math.max(0, (box.height - f * (CELL.heightEm + (pressureLine ? CELL.pressureLineEm : 0))) / 2);
  const inset = view.border * Math.min(box.width, box.height);
  const pad = f * 0.1 + inset;
  const top = f * 0.05 + inset * 0.6;
  const corner = cornerSymbols(view);
  const runs: TextRun[] = [];
  if (view.exact && exact)
    runs.push({
      text: localiseNumbers(view.exact, nf),
      weight: 400,
      size: small,
      x: box.x + pad,
      y: box.y + top,
      tnum: true,
    });
  if (corner)
    runs.push({
      text: corner,
      weight: 700,
      size: small * 1.1,
      x: box.x,
      y: box.y + top,
      align: { width: box.width - pad, to: "right" },
      tnum: false,
    });
  runs.push({
    text: localiseNumbers(view.primary, nf),
    weight: 700,
    size: f,
    x: box.x,
    y: box.y + lift + f * CELL.figureTopEm,
    align: { width: box.width, to: "center" },
    tnum: true,
  });
  if (pressureLine && view.pressure)
    runs.push({
      text: localiseNumbers(view.pressure, nf),
      weight: 700,
      size: small,
      x: box.x,
      y: box.y + lift + f * (CELL.figureTopEm + 1.02),
      align: { width: box.width, to: "center" },
      tnum: true,
    });
  return runs;
}

/** A row or column heading: bold tabular figures centred in their box, as large as `size`. */
export function headingRun(box: Box, text: string, size: number): TextRun {
  return {
    text,
    weight: 700,
    size,
    x: box.x,
    y: box.y + (box.height - size) / 2,
    align: { width: box.width, to: "center" },
    tnum: true,
  };
}

/**
 * Every single line of one grid, in the PDF's reading order: the column headings, the row
 * headings, then each cell's words row by row. The poster and the badge card word grids alike.
 */
export function gridTextRuns(
  grid: Grid,
  g: GridFrame,
  f: number,
  headPt: number,
  nf: NumberFormat = "point",
  exact = true,
): TextRun[] {
  const loc = (mm: number) => localiseNumbers(formatAxisMm(mm), nf);
  const pressureLine = grid.rounding === "reach";
  return [
    ...grid.colAxis.values.map((c, j) =>
      headingRun(
        { x: g.cellsX + j * g.cellWidth, y: g.cellsY - g.colHeadHeight, width: g.cellWidth, height: g.colHeadHeight },
        loc(c),
        headPt,
      ),
    ),
    ...grid.rowAxis.values.map((r, i) =>
      headingRun(
        { x: g.cellsX - g.rowHeadWidth, y: g.cellsY + i * g.cellHeight, width: g.rowHeadWidth, height: g.cellHeight },
        loc(r),
        headPt,
      ),
    ),
    ...grid.cells.flatMap((row, i) =>
      row.flatMap((cell, j) =>
        cellTextRuns({ view: cellView(cell), box: cellBox(g, i, j), f, pressureLine, exact }, nf),
      ),
    ),
  ];
}
