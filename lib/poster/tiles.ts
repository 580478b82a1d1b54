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
  /** Where the poster's origin sits in the tiled area: the spare length is split evenly. */
  offsetXMm: number;
  offsetYMm: number;
  tiles: Tile[];
};

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

function planFor(posterW: number, posterH: number, sheet: TileSheet, orientation: Orientation): TilePlan {
  const p = PAPERS[sheet];
  const sheetW = orientation === "portrait" ? p.widthMm : p.heightMm;
  const sheetH = orientation === "portrait" ? p.heightMm : p.widthMm;
  const winW = sheetW - 2 * TILE_MARGIN_MM;
  const winH = sheetH - 2 * TILE_MARGIN_MM;
  const stepX = winW - TILE_OVERLAP_MM;
  const stepY = winH - TILE_OVERLAP_MM;
  // cols sheets cover (cols - 1) * step + window; never fewer than one.
  const cols = Math.max(1, Math.ceil((posterW - winW) / stepX - 1e-9) + 1);
  const rows = Math.max(1, Math.ceil((posterH - winH) / stepY - 1e-9) + 1);
  const offsetX = ((cols - 1) * stepX + winW - posterW) / 2;
  const offsetY = ((rows - 1) * stepY + winH - posterH) / 2;
  const tiles: Tile[] = [];
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < cols; c++)
      tiles.push({
        label: `${columnLetter(c)}${r + 1}`,
        col: c,
        row: r,
        x: c * stepX - offsetX,
        y: r * stepY - offsetY,
        width: winW,
        height: winH,
      });
  return {
    sheet,
    orientation,
    sheetWidthMm: sheetW,
    sheetHeightMm: sheetH,
    cols,
    rows,
    windowWidthMm: winW,
    windowHeightMm: winH,
    offsetXMm: offsetX,
    offsetYMm: offsetY,
    tiles,
  };
}

/** The plan with fewer sheets, portrait or landscape (portrait on a tie). */
export function tilePlan(posterWidthMm: number, posterHeightMm: number, sheet: TileSheet): TilePlan {
  const portrait = planFor(posterWidthMm, posterHeightMm, sheet, "portrait");
  const landscape = planFor(posterWidthMm, posterHeightMm, sheet, "landscape");
  return landscape.tiles.length < portrait.tiles.length ? landscape : portrait;
}

/** "Sheet B3 of C4": the last label names the size of the grid of sheets. */
export function tileCaption(plan: TilePlan, tile: Tile): string {
  return `Sheet ${tile.label} of ${columnLetter(plan.cols - 1)}${plan.rows}`;
}
