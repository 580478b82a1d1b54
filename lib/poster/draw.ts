// Vector drawing of cell marks as a few paths rather than one element per cell: the poster draws
// every grid's backgrounds (one path per colour), hatching, rules and heavy borders in one SVG,
// which keeps rendering fast on big grids. Coordinates are PDF points on the page.
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
  /** Backgrounds that are not plain white: one path of rectangles per colour. */
  fills: { color: string; d: string }[];
  hatch: string;
  /**
   * Every cell's outline as the fewest straight lines: the edges of all cells, collinear ones
   * that touch or overlap joined end to end (a 10 x 12 grid is 24 lines, not 120 rectangles).
   * Stroked with square caps, so the corners close as a rectangle's outline does.
   */
  rules: string;
  /** Heavy inset borders: the box to stroke (already inset by half the width) and the width. */
  borders: { box: Box; width: number }[];
};

/** Joins intervals on one line that touch or overlap; the result is sorted and disjoint. */
export function mergeIntervals(spans: [number, number][], eps = 1e-3): [number, number][] {
  const sorted = [...spans].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const out: [number, number][] = [];
  for (const [a, b] of sorted) {
    const last = out[out.length - 1];
    if (last && a <= last[1] + eps) last[1] = Math.max(last[1], b);
    else out.push([a, b]);
  }
  return out;
}

/** The outlines of the boxes as horizontal and vertical lines, each drawn once (`M x y H x1`, `M x y V y1`). */
export function outlinePath(boxes: readonly Box[]): string {
  const rows = new Map<number, [number, number][]>();
  const cols = new Map<number, [number, number][]>();
  const add = (m: Map<number, [number, number][]>, at: number, a: number, b: number) => {
    const list = m.get(at);
    if (list) list.push([a, b]);
    else m.set(at, [[a, b]]);
  };
  for (const b of boxes) {
    const [x0, y0, x1, y1] = [n(b.x), n(b.y), n(b.x + b.width), n(b.y + b.height)];
    add(rows, y0, x0, x1);
    add(rows, y1, x0, x1);
    add(cols, x0, y0, y1);
    add(cols, x1, y0, y1);
  }
  let d = "";
  for (const [y, spans] of rows) for (const [a, b] of mergeIntervals(spans)) d += `M${a} ${y}H${b}`;
  for (const [x, spans] of cols) for (const [a, b] of mergeIntervals(spans)) d += `M${x} ${a}V${b}`;
  return d;
}

export function cellGraphics(cells: readonly DrawnCell[], paper = "#ffffff"): CellGraphics {
  const fills = new Map<string, string>();
  const out: CellGraphics = { fills: [], hatch: "", rules: outlinePath(cells.map((c) => c.box)), borders: [] };
  for (const { box, view } of cells) {
    const color = view.background.toLowerCase();
    if (color !== paper) fills.set(color, (fills.get(color) ?? "") + rectPath(box));
    if (view.hatch) out.hatch += hatchSegments(box);
    if (view.border > 0) {
      const w = view.border * Math.min(box.width, box.height);
      out.borders.push({
        box: { x: box.x + w / 2, y: box.y + w / 2, width: box.width - w, height: box.height - w },
        width: w,
      });
    }
  }
  out.fills = [...fills].map(([color, d]) => ({ color, d }));
  return out;
}
