// Vector drawing of cell marks as a few paths rather than one element per line: the poster draws
// every grid's backgrounds, hatching, rules and heavy borders in one SVG, which keeps rendering
// fast on big grids. Coordinates are PDF points on the page.
import type { Box } from "./layout";
import type { CellView } from "./marks";

export type DrawnCell = { box: Box; view: Pick<CellView, "background" | "hatch" | "border"> };

const n = (x: number) => Number(x.toFixed(3));

/** Diagonal hatch lines ("/" direction) clipped to a box: `count` across its longer side, never closer than `minStep`. */
export function hatchSegments(b: Box, count = 5, minStep = 3): string {
  const step = Math.max(Math.max(b.width, b.height) / count, minStep);
  if (!(step > 0)) return "";
  let d = "";
  for (let k = -b.height + step / 2; k < b.width; k += step) {
    // Points (k + t, height - t) for t in [0, height], clipped to 0 <= x <= width.
    const t0 = Math.max(0, -k);
    const t1 = Math.min(b.height, b.width - k);
    if (t1 - t0 <= 1e-9) continue;
    d += `M${n(b.x + k + t0)} ${n(b.y + b.height - t0)}L${n(b.x + k + t1)} ${n(b.y + b.height - t1)}`;
  }
  return d;
}

const rectPath = (b: Box) => `M${n(b.x)} ${n(b.y)}h${n(b.width)}v${n(b.height)}h${n(-b.width)}z`;

export type CellGraphics = {
  /** Filled backgrounds that are not plain white. */
  fills: { box: Box; color: string }[];
  hatch: string;
  /** Every cell's outline, one path. */
  rules: string;
  /** Heavy inset borders: the box to stroke (already inset by half the width) and the width. */
  borders: { box: Box; width: number }[];
};

export function cellGraphics(cells: readonly DrawnCell[], paper = "#ffffff"): CellGraphics {
  const out: CellGraphics = { fills: [], hatch: "", rules: "", borders: [] };
  for (const { box, view } of cells) {
    if (view.background.toLowerCase() !== paper) out.fills.push({ box, color: view.background });
    if (view.hatch) out.hatch += hatchSegments(box);
    out.rules += rectPath(box);
    if (view.border > 0) {
      const w = view.border * Math.min(box.width, box.height);
      out.borders.push({
        box: { x: box.x + w / 2, y: box.y + w / 2, width: box.width - w, height: box.height - w },
        width: w,
      });
    }
  }
  return out;
}
