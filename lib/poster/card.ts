// The badge card: ISO/IEC 7810 ID-1 (85.60 x 53.98 mm), one lookup per side, read in the hand.
// Pure geometry in PDF points; lib/poster/pdf/card.tsx draws it. The figures are at least the
// 20′ guide at CARD_READING_DISTANCE_M; a lookup wider or taller than fits is narrowed to a
// range of rows and columns (the chart's card choice, or the middle of its axes).
import type { Snapshot } from "@/lib/charts/snapshot";
import type { Grid, Vessel } from "@/lib/sizing";
import type { CardSide } from "@/lib/validation/chart";
import { CELL, fontPtForArcmin, type Box } from "./layout";
import { formatAxisMm } from "./marks";
import { cardExceptionLine } from "./exceptions";
import { mmToPt } from "./paper";

export const CARD_WIDTH_MM = 85.6;
export const CARD_HEIGHT_MM = 53.98;
export const CARD_READING_DISTANCE_M = 0.4;
export const CARD_MIN_ARCMIN = 20;

export const CARD_PAGE = { width: mmToPt(CARD_WIDTH_MM), height: mmToPt(CARD_HEIGHT_MM) };
/** Smallest figure (pt) legible at the card's reading distance. */
export const CARD_MIN_FIGURE_PT = fontPtForArcmin(CARD_READING_DISTANCE_M, CARD_MIN_ARCMIN);

/** A side of the card: which lookup, and optionally which rows and columns (axis values, inclusive). */
export type { CardSide };

export type CardLayout = {
  page: { width: number; height: number };
  margin: number;
  /** Lookup title and the code, above the grid (below the space kept for a status band). */
  head: Box;
  grid: {
    cellsX: number;
    cellsY: number;
    cellWidth: number;
    cellHeight: number;
    rowHeadWidth: number;
    colHeadHeight: number;
  };
  figurePt: number;
  /** Whether the exact diameters (small print in a cell) are legible at the card's distance. */
  exact: boolean;
  qr: Box;
  code: Box;
  key: Box;
  caution: Box;
};

/** The head's two lines (lib/poster/pdf/card.tsx): the lookup's title, then law, chart title and edition. */
export const CARD_HEAD_LINES = {
  title: { fontSize: 6, lineHeight: 1.05 },
  detail: { fontSize: 4.6, lineHeight: 1 },
} as const;
/** Both head lines and a little air: they must not reach the grid below (tests/unit/poster/card.test.ts). */
export const CARD_HEAD_HEIGHT = 11;

const MARGIN = mmToPt(2.5);
/** Kept clear at the top for the NOT CURRENT band (lib/poster/pdf/variants.ts draws 12 pt). */
const BAND = 12.5;
const QR_SIDE = mmToPt(17);

/** The sides of a chart with no card choice: lookup 1 then 2 (or 1 twice), the middle of each axis. */
export function defaultCardSides(lookupCount: number): [CardSide, CardSide] {
  return [{ lookup: 0 }, { lookup: lookupCount > 1 ? 1 : 0 }];
}

/** Which lookup and range each side prints: the chart's choice, else the default. */
export function cardSides(snapshot: Snapshot): [CardSide, CardSide] {
  return snapshot.card?.sides ?? defaultCardSides(snapshot.lookups.length);
}

/** What each face prints: a lookup, or ("key") the legend, caution, dates and QR code. */
export type CardFace = CardSide | "key";

/**
 * The card's two faces: the chart's choice; else a one-lookup chart prints its grid on the
 * front and the key on the back (the same table twice would say nothing more), two lookups one each.
 */
export function cardFaces(snapshot: Snapshot): [CardFace, CardFace] {
  if (snapshot.card) return snapshot.card.sides;
  return snapshot.lookups.length > 1 ? defaultCardSides(snapshot.lookups.length) : [{ lookup: 0 }, "key"];
}

const SHORT_VESSEL: Readonly<Record<Vessel, string>> = { parent: "parent", mb: "main", sb: "side" };

const range = (values: readonly number[]) =>
  values.length === 0
    ? "none"
    : values.length === 1
      ? formatAxisMm(values[0] as number)
      : `${formatAxisMm(values[0] as number)}-${formatAxisMm(values[values.length - 1] as number)}`;

/**
 * "main 2.5-3.75 mm, side 2.0-3.25 mm of this chart (all of it: main 2.5-4.0, side 2.0-3.5 mm)":
 * the rows and columns a side prints, and the chart's whole axes when the card leaves some out.
 */
export function cardCoverage(full: Grid, shown: Grid): string {
  const part = (g: Grid, unit: string) =>
    `${SHORT_VESSEL[g.rowAxis.vessel]} ${range(g.rowAxis.values)}${unit}, ${SHORT_VESSEL[g.colAxis.vessel]} ${range(g.colAxis.values)}${unit}`;
  const whole =
    full.rowAxis.values.length === shown.rowAxis.values.length &&
    full.colAxis.values.length === shown.colAxis.values.length;
  return whole
    ? `all of this chart: ${part(shown, " mm")}`
    : `${part(shown, " mm")} of this chart (all of it: ${part(full, "")} mm)`;
}

function box(x: number, y: number, width: number, height: number): Box {
  return { x, y, width, height };
}

/** Rows and columns that fit at the minimum figure size. */
export function cardCapacity(pressureLine: boolean, keyLines = 1): { rows: number; cols: number } {
  const l = cardFrame(keyLines);
  const f = CARD_MIN_FIGURE_PT;
  const cols = Math.floor((l.gridArea.width - f * CELL.rowHeadWidthEm) / (f * CELL.widthEm));
  const rows = Math.floor(
    (l.gridArea.height - f * CELL.colHeadHeightEm) / (f * (CELL.heightEm + (pressureLine ? CELL.pressureLineEm : 0))),
  );
  return { rows, cols };
}

/** One line of the key's 4.4 pt text, and the share of the card's width a character takes at that size. */
const KEY_LINE_PT = 4.8;
const KEY_CHAR_PT = 2.3;

/** Lines the key needs: the mark words, then each exception in force (lib/poster/exceptions.ts). */
export function cardKeyLines(snapshot: Pick<Snapshot, "ruleExceptions">): number {
  const width = CARD_PAGE.width - 2 * MARGIN;
  return (snapshot.ruleExceptions ?? []).reduce(
    (n, e) => n + Math.ceil((cardExceptionLine(e).length * KEY_CHAR_PT) / width),
    1,
  );
}

function cardFrame(keyLines = 1) {
  const { width: W, height: H } = CARD_PAGE;
  const headH = CARD_HEAD_HEIGHT;
  // Four lines of the 3.9 pt caution (4.5 pt each) and its padding: the demo lab's caution, the longest, needs all four.
  const cautionH = 20;
  const keyH = 6 + (keyLines - 1) * KEY_LINE_PT;
  const top = BAND + 1;
  const head = box(MARGIN, top, W - 2 * MARGIN, headH);
  const caution = box(MARGIN, H - MARGIN - cautionH, W - 2 * MARGIN, cautionH);
  const key = box(MARGIN, caution.y - keyH, W - 2 * MARGIN, keyH);
  const gridTop = head.y + headH + 1;
  const qrCol = QR_SIDE + 2;
  const gridArea = box(MARGIN, gridTop, W - 2 * MARGIN - qrCol, key.y - gridTop - 1);
  const qr = box(W - MARGIN - QR_SIDE, gridTop, QR_SIDE, QR_SIDE);
  const code = box(qr.x - 2, qr.y + QR_SIDE, QR_SIDE + 4, 16);
  return { head, caution, key, gridArea, qr, code };
}

/** Narrows an axis to at most `max` values: the chosen range, else the middle of the axis. */
export function narrowAxis(values: readonly number[], max: number, range?: [number, number]): number[] {
  const chosen = range ? values.filter((v) => v >= range[0] - 1e-9 && v <= range[1] + 1e-9) : [...values];
  if (chosen.length <= max) return chosen;
  const start = Math.floor((chosen.length - max) / 2);
  return chosen.slice(start, start + max);
}

/** The grid cut down to the side's rows and columns. */
export function cardGrid(grid: Grid, side: CardSide, keyLines = 1): Grid {
  const cap = cardCapacity(grid.rounding === "reach", keyLines);
  const rows = narrowAxis(grid.rowAxis.values, cap.rows, side.rows);
  const cols = narrowAxis(grid.colAxis.values, cap.cols, side.cols);
  const ri = rows.map((v) => grid.rowAxis.values.indexOf(v));
  const ci = cols.map((v) => grid.colAxis.values.indexOf(v));
  return {
    ...grid,
    rowAxis: { ...grid.rowAxis, values: rows },
    colAxis: { ...grid.colAxis, values: cols },
    cells: ri.map((r) => ci.map((c) => grid.cells[r]?.[c] as Grid["cells"][number][number])),
  };
}

export function layoutCard(grid: Grid, keyLines = 1): CardLayout {
  const frame = cardFrame(keyLines);
  const rows = grid.rowAxis.values.length;
  const cols = grid.colAxis.values.length;
  const hEm = CELL.heightEm + (grid.rounding === "reach" ? CELL.pressureLineEm : 0);
  const a = frame.gridArea;
  const f = Math.min(
    a.width / (CELL.rowHeadWidthEm + cols * CELL.widthEm),
    a.height / (CELL.colHeadHeightEm + rows * hEm),
    CARD_MIN_FIGURE_PT * 1.6,
  );
  const rowHeadWidth = f * CELL.rowHeadWidthEm;
  const colHeadHeight = f * CELL.colHeadHeightEm;
  const w = rowHeadWidth + cols * f * CELL.widthEm;
  const h = colHeadHeight + rows * f * hEm;
  const x = a.x + (a.width - w) / 2;
  const y = a.y + (a.height - h) / 2;
  return {
    page: CARD_PAGE,
    margin: MARGIN,
    head: frame.head,
    grid: {
      cellsX: x + rowHeadWidth,
      cellsY: y + colHeadHeight,
      cellWidth: f * CELL.widthEm,
      cellHeight: f * hEm,
      rowHeadWidth,
      colHeadHeight,
    },
    figurePt: f,
    exact: f * CELL.smallRatio >= CARD_MIN_FIGURE_PT,
    qr: frame.qr,
    code: frame.code,
    key: frame.key,
    caution: frame.caution,
  };
}

export type CardKeyLayout = {
  page: { width: number; height: number };
  head: Box;
  body: Box;
  qr: Box;
  code: Box;
  caution: Box;
};

/** The key face: title at the top, legend and dates at the left, a larger QR code at the right, the caution below. */
export function layoutCardKey(): CardKeyLayout {
  const frame = cardFrame();
  const qrSide = mmToPt(21);
  const top = frame.head.y + frame.head.height + 1;
  const qr = box(CARD_PAGE.width - MARGIN - qrSide, top, qrSide, qrSide);
  return {
    page: CARD_PAGE,
    head: frame.head,
    body: box(MARGIN, top, qr.x - 3 - MARGIN, frame.caution.y - 1.5 - top),
    qr,
    code: box(qr.x - 2, qr.y + qrSide, qrSide + 4, frame.caution.y - qr.y - qrSide - 1),
    caution: frame.caution,
  };
}
