// Tiled printing: a large poster at 100 % scale split over office sheets. Pure geometry in
// millimetres; lib/poster/pdf/variants.ts draws the sheets. The sheets overlap by TILE_OVERLAP_MM
// so they can be trimmed and taped; each sheet keeps a TILE_MARGIN_MM border that office printers
// cannot print to anyway, where the label and the alignment marks go.
import { PAPERS, type Orientation, type PaperId } from "./paper";

export const TILE_SHEETS = ["A4", "A3", "LETTER", "TABLOID"] as const satisfies readonly PaperId[];
export type TileSheet = (typeof TILE_SHEETS)[number];
export const TILE_OVERLAP_MM = 10;
export const TILE_MARGIN_MM = 10;

export type Tile = {
  /** "B3": column letter, row number. */
  label: string;
  col: number;
  row: number;
  /** The part of the poster this sheet prints (mm from the poster's top-left corner). */
  x: number;
  y: number;
  width: number;
  height: number;
};

export type TilePlan = {
  sheet: TileSheet;
  orientation: Orientation;
  sheetWidthMm: number;
  sheetHeightMm: number;
  cols: number;
  rows: number;
  /** Printed width and height of poster on each sheet (the sheet less its margins). */
  windowWidthMm: number;
  windowHeightMm: number;
  /** Where the poster's origin sits in the tiled area (the first sheet starts this far before it). */
  offsetXMm: number;
  offsetYMm: number;
  /** The tiled area: from the first sheet's edge to the last sheet's. */
  totalWidthMm: number;
  totalHeightMm: number;
  tiles: Tile[];
};

/** A stretch of the poster (mm, from its top or left edge) that no seam may cut: a cell, a heading, the QR code. */
export type Span = readonly [number, number];
/** What must stay whole: spans across the poster (cut by vertical seams) and down it (horizontal seams). */
export type KeepWhole = { x: readonly Span[]; y: readonly Span[] };

const EPS = 1e-6;

/**
 * Where each sheet starts along one direction. A sheet reaches `window` from its start and the next
 * sheet's cut edge (the seam) lies at least `overlap` before its end; the seam goes as far along
 * as it can without falling inside a kept span, so it lands on a cell rule rather than through a
 * figure. Only if that would shorten the step below half a window is a span cut.
 */
export function sheetStarts(start: number, length: number, window: number, overlap: number, keep: readonly Span[]) {
  const starts = [start];
  for (let at = start; at + window < length - EPS;) {
    const limit = at + window - overlap;
    let seam = limit;
    for (let moved = true; moved;) {
      moved = false;
      for (const [a, b] of keep)
        if (a + EPS < seam && seam < b - EPS) {
          seam = a;
          moved = true;
        }
    }
    if (seam < at + window / 2) seam = limit;
    starts.push(seam);
    at = seam;
  }
  return starts;
}

/** Spreadsheet-style column letters: A..Z, AA.. */
export function columnLetter(i: number): string {
  let s = "";
  let n = i + 1;
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

function planFor(
  posterW: number,
  posterH: number,
  sheet: TileSheet,
  orientation: Orientation,
  keep: KeepWhole,
): TilePlan {
  const p = PAPERS[sheet];
  const sheetW = orientation === "portrait" ? p.widthMm : p.heightMm;
  const sheetH = orientation === "portrait" ? p.heightMm : p.widthMm;
  const winW = sheetW - 2 * TILE_MARGIN_MM;
  const winH = sheetH - 2 * TILE_MARGIN_MM;
  // The spare length of an even plan is split before and after the poster.
  const even = (length: number, win: number) => {
    const n = Math.max(1, Math.ceil((length - win) / (win - TILE_OVERLAP_MM) - 1e-9) + 1);
    return ((n - 1) * (win - TILE_OVERLAP_MM) + win - length) / 2;
  };
  const xs = sheetStarts(-even(posterW, winW), posterW, winW, TILE_OVERLAP_MM, keep.x);
  const ys = sheetStarts(-even(posterH, winH), posterH, winH, TILE_OVERLAP_MM, keep.y);
  const tiles: Tile[] = ys.flatMap((y, r) =>
    xs.map((x, c) => ({ label: `${columnLetter(c)}${r + 1}`, col: c, row: r, x, y, width: winW, height: winH })),
  );
  return {
    sheet,
    orientation,
    sheetWidthMm: sheetW,
    sheetHeightMm: sheetH,
    cols: xs.length,
    rows: ys.length,
    windowWidthMm: winW,
    windowHeightMm: winH,
    offsetXMm: -(xs[0] as number),
    offsetYMm: -(ys[0] as number),
    totalWidthMm: (xs[xs.length - 1] as number) + winW - (xs[0] as number),
    totalHeightMm: (ys[ys.length - 1] as number) + winH - (ys[0] as number),
    tiles,
  };
}

/** The plan with fewer sheets, portrait or landscape (portrait on a tie), seams clear of `keep`. */
export function tilePlan(
  posterWidthMm: number,
  posterHeightMm: number,
  sheet: TileSheet,
  keep: KeepWhole = { x: [], y: [] },
): TilePlan {
  const portrait = planFor(posterWidthMm, posterHeightMm, sheet, "portrait", keep);
  const landscape = planFor(posterWidthMm, posterHeightMm, sheet, "landscape", keep);
  return landscape.tiles.length < portrait.tiles.length ? landscape : portrait;
}

/** "Sheet B3 of C4": the last label names the size of the grid of sheets. */
export function tileCaption(plan: TilePlan, tile: Tile): string {
  return `Sheet ${tile.label} of ${columnLetter(plan.cols - 1)}${plan.rows}`;
}
