// What a tiled set's seams must not cut (lib/poster/tiles.ts sheetStarts): every cell, heading
// and axis title of the grids, and the QR code with its words. A vertical seam crosses the whole
// poster, so a span across is kept only for things narrow enough to dodge (a column of cells,
// the QR code); lines of words that run the width of the poster are kept whole downwards only.
import type { Grid } from "@/lib/sizing";
import type { Box, PosterLayout } from "./layout";
import type { KeepWhole, Span } from "./tiles";

const MM_PER_PT = 25.4 / 72;
const across = (b: Box): Span => [b.x * MM_PER_PT, (b.x + b.width) * MM_PER_PT];
const down = (b: Box): Span => [b.y * MM_PER_PT, (b.y + b.height) * MM_PER_PT];

export function posterKeepWhole(layout: PosterLayout, grids: readonly Grid[]): KeepWhole {
  const x: Span[] = [];
  const y: Span[] = [];
  grids.forEach((grid, i) => {
    const g = layout.grids[i];
    if (!g) return;
    const cols = grid.colAxis.values.length;
    const rows = grid.rowAxis.values.length;
    // The row headings' column, then each column of cells (its heading above it).
    x.push(across({ x: g.cellsX - g.rowHeadWidth, y: 0, width: g.rowHeadWidth, height: 0 }), across(g.rowAxis));
    for (let c = 0; c < cols; c++)
      x.push(across({ x: g.cellsX + c * g.cellWidth, y: 0, width: g.cellWidth, height: 0 }));
    y.push(
      down({ x: 0, y: g.cellsY - g.colHeadHeight, width: 0, height: g.colHeadHeight }),
      down(g.colAxis),
      down(g.title),
    );
    for (let r = 0; r < rows; r++)
      y.push(down({ x: 0, y: g.cellsY + r * g.cellHeight, width: 0, height: g.cellHeight }));
  });
  const qr = {
    x: layout.qr.x,
    y: layout.qr.y,
    width: layout.qr.width,
    height: layout.qrText.y + layout.qrText.height - layout.qr.y,
  };
  x.push(across(qr));
  y.push(down(qr));
  for (const { swatch, text } of layout.legendRows) {
    const top = Math.min(swatch.y, text.y);
    y.push(down({ x: 0, y: top, width: 0, height: Math.max(swatch.y + swatch.height, text.y + text.height) - top }));
  }
  return { x, y };
}
