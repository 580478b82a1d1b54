import { describe, expect, it } from "vitest";
import { cellGraphics, hatchSegments, mergeIntervals, outlinePath } from "@/lib/poster/draw";
import type { Box } from "@/lib/poster/layout";

const points = (d: string) =>
  [...d.matchAll(/[ML](-?[\d.]+) (-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])] as const);

describe("cell drawing", () => {
  it("clips hatch lines to their cell, all running the same diagonal", () => {
    for (const box of [
      { x: 10, y: 20, width: 80, height: 45 },
      { x: 0, y: 0, width: 30, height: 60 },
    ]) {
      const d = hatchSegments(box);
      const pts = points(d);
      expect(pts.length).toBeGreaterThanOrEqual(8);
      for (const [x, y] of pts) {
        expect(x).toBeGreaterThanOrEqual(box.x - 1e-3);
        expect(x).toBeLessThanOrEqual(box.x + box.width + 1e-3);
        expect(y).toBeGreaterThanOrEqual(box.y - 1e-3);
        expect(y).toBeLessThanOrEqual(box.y + box.height + 1e-3);
      }
      for (let i = 0; i < pts.length; i += 2) {
        const [x0, y0] = pts[i] as readonly [number, number];
        const [x1, y1] = pts[i + 1] as readonly [number, number];
        expect(x1 - x0).toBeCloseTo(y0 - y1, 2); // 45 degrees, rising to the right
      }
    }
    expect(hatchSegments({ x: 0, y: 0, width: 0, height: 0 })).toBe("");
  });

  it("fills only coloured cells, hatches only hatched ones and insets heavy borders by half their width", () => {
    const g = cellGraphics([
      { box: { x: 0, y: 0, width: 40, height: 20 }, view: { background: "#ffffff", hatch: false, border: 0 } },
      { box: { x: 40, y: 0, width: 40, height: 20 }, view: { background: "#c8c8c8", hatch: true, border: 0 } },
      { box: { x: 80, y: 0, width: 40, height: 20 }, view: { background: "#e69f00", hatch: false, border: 0.1 } },
    ]);
    expect(g.fills.map((f) => f.color)).toEqual(["#c8c8c8", "#e69f00"]);
    expect(g.fills[0]!.d).toBe("M40 0h40v20h-40z");
    expect(points(g.hatch).every(([x]) => x >= 40 && x <= 80)).toBe(true);
    expect(g.borders).toEqual([{ box: { x: 81, y: 1, width: 38, height: 18 }, width: 2 }]);
    // Three cells in a row: two long horizontal lines and four vertical ones.
    expect(g.rules).toBe("M0 0H120M0 20H120M0 0V20M40 0V20M80 0V20M120 0V20");
  });

  it("joins touching and overlapping intervals and keeps gaps", () => {
    expect(
      mergeIntervals([
        [5, 8],
        [0, 2],
        [2, 4],
        [7, 9],
      ]),
    ).toEqual([
      [0, 4],
      [5, 9],
    ]);
    expect(mergeIntervals([])).toEqual([]);
  });

  it("outlines exactly the edges of the boxes: every edge point is on a line, every line point on an edge", () => {
    // A 10 x 12 grid with its heading row and column, and a separate block with a gap.
    const boxes: Box[] = [];
    for (let r = 0; r < 11; r++)
      for (let c = 0; c < 13; c++) boxes.push({ x: 30 + c * 41.3, y: 50 + r * 27.7, width: 41.3, height: 27.7 });
    boxes.push({ x: 30, y: 400, width: 50, height: 20 }, { x: 90, y: 400, width: 50, height: 20 });
    const d = outlinePath(boxes);
    const lines = [...d.matchAll(/M(-?[\d.]+) (-?[\d.]+)([HV])(-?[\d.]+)/g)].map((m) => ({
      x: Number(m[1]),
      y: Number(m[2]),
      dir: m[3] as "H" | "V",
      to: Number(m[4]),
    }));
    // 12 horizontal and 14 vertical lines for the grid; 4 + 4 for the two boxes with a gap between.
    expect(lines.length).toBe(12 + 14 + 4 + 4);
    const onLine = (x: number, y: number) =>
      lines.some((l) =>
        l.dir === "H"
          ? Math.abs(y - l.y) < 2e-3 && x >= l.x - 2e-3 && x <= l.to + 2e-3
          : Math.abs(x - l.x) < 2e-3 && y >= l.y - 2e-3 && y <= l.to + 2e-3,
      );
    const onEdge = (x: number, y: number) =>
      boxes.some(
        (b) =>
          ((Math.abs(y - b.y) < 2e-3 || Math.abs(y - b.y - b.height) < 2e-3) &&
            x >= b.x - 2e-3 &&
            x <= b.x + b.width + 2e-3) ||
          ((Math.abs(x - b.x) < 2e-3 || Math.abs(x - b.x - b.width) < 2e-3) &&
            y >= b.y - 2e-3 &&
            y <= b.y + b.height + 2e-3),
      );
    for (const b of boxes)
      for (let t = 0; t <= 1; t += 0.125) {
        expect(onLine(b.x + t * b.width, b.y)).toBe(true);
        expect(onLine(b.x + t * b.width, b.y + b.height)).toBe(true);
        expect(onLine(b.x, b.y + t * b.height)).toBe(true);
        expect(onLine(b.x + b.width, b.y + t * b.height)).toBe(true);
      }
    for (const l of lines)
      for (let t = 0; t <= 1; t += 1 / 64) {
        const x = l.dir === "H" ? l.x + t * (l.to - l.x) : l.x;
        const y = l.dir === "V" ? l.y + t * (l.to - l.y) : l.y;
        expect(onEdge(x, y), `${x},${y}`).toBe(true);
      }
    // The gap between the two separate boxes stays open.
    expect(onLine(85, 400)).toBe(false);
  });
});
