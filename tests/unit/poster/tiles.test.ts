import { describe, expect, it } from "vitest";
import { sheetStarts, tilePlan, TILE_OVERLAP_MM, type Span } from "@/lib/poster/tiles";

// Cells 40 mm wide from 100 mm on: rules at 100, 140, 180, ...
const cells: Span[] = Array.from({ length: 10 }, (_, i) => [100 + 40 * i, 140 + 40 * i] as const);

describe("sheetStarts", () => {
  it("without spans to keep, steps a window less the overlap", () => {
    expect(sheetStarts(0, 500, 190, 10, [])).toEqual([0, 180, 360]);
  });

  it("moves each seam back to the cell rule before it, keeping at least the overlap", () => {
    const starts = sheetStarts(0, 600, 190, 10, cells);
    // 180 is a rule; 180 + 180 = 360 falls inside the cell 340-380, so the seam goes back to 340.
    expect(starts.slice(0, 3)).toEqual([0, 180, 340]);
    for (let i = 1; i < starts.length; i++) {
      const seam = starts[i] as number;
      expect(cells.some(([a, b]) => seam > a && seam < b)).toBe(false);
      expect((starts[i - 1] as number) + 190 - seam).toBeGreaterThanOrEqual(TILE_OVERLAP_MM);
    }
    expect((starts[starts.length - 1] as number) + 190).toBeGreaterThanOrEqual(600);
  });

  it("cuts a span longer than half a window rather than printing slivers", () => {
    expect(sheetStarts(0, 400, 190, 10, [[20, 300]])).toEqual([0, 180, 360]);
  });

  it("a plan with spans to keep may need more sheets, never fewer, and covers the poster", () => {
    const even = tilePlan(594, 841, "A4");
    const kept = tilePlan(594, 841, "A4", { x: cells, y: cells });
    expect(kept.tiles.length).toBeGreaterThanOrEqual(even.tiles.length);
    const right = Math.max(...kept.tiles.map((t) => t.x + t.width));
    const bottom = Math.max(...kept.tiles.map((t) => t.y + t.height));
    expect(right).toBeGreaterThanOrEqual(594);
    expect(bottom).toBeGreaterThanOrEqual(841);
    expect(kept.totalWidthMm).toBeCloseTo(right - (kept.tiles[0]?.x ?? 0), 6);
  });
});
