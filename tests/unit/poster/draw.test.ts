import { describe, expect, it } from "vitest";
import { cellGraphics, hatchSegments } from "@/lib/poster/draw";

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
    expect(points(g.hatch).every(([x]) => x >= 40 && x <= 80)).toBe(true);
    expect(g.borders).toEqual([{ box: { x: 81, y: 1, width: 38, height: 18 }, width: 2 }]);
    expect(g.rules.match(/z/g)).toHaveLength(3);
  });
});
