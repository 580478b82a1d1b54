// Tiled sets never cut a figure: every sized cell's balloon figure of an A1 poster is read back
// whole (pdftotext -bbox), inside the printed window of some sheet and at its own cell's place,
// for the poster tiled on A4, A3 and Letter.
import { describe, expect, it } from "vitest";
import { cellBox, type GridLayout } from "@/lib/poster/layout";
import { cellView } from "@/lib/poster/marks";
import { posterModel } from "@/lib/poster/pdf/document";
import { printEdition } from "@/lib/poster/pdf/print";
import { posterKeepWhole } from "@/lib/poster/seams";
import { tilePlan, TILE_MARGIN_MM, type TileSheet } from "@/lib/poster/tiles";
import { pdfWords } from "@/tests/support/pdf-tools";
import { posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const PT = 72 / 25.4;
const snapshot = snapshotOf({ ...potDefinition, paper: "A1" });
const input = posterInput(snapshot);
const { layout, grids } = posterModel(input);

/** Every sized cell: its printed figure and its box on the poster (pt). */
const figures = grids.flatMap((grid, gi) =>
  grid.cells.flatMap((row, i) =>
    row.flatMap((cell, j) => {
      const view = cellView(cell);
      return view.primaryIsSize ? [{ text: view.primary, box: cellBox(layout.grids[gi] as GridLayout, i, j) }] : [];
    }),
  ),
);

describe("seams of a tiled A1 poster", () => {
  it("the fixture has figures worth cutting, and an even plan would cut some", () => {
    expect(figures.length).toBeGreaterThan(20);
    const keep = posterKeepWhole(layout, grids);
    const w = layout.page.width / PT;
    const h = layout.page.height / PT;
    const cut = (plan: ReturnType<typeof tilePlan>) =>
      figures.filter(({ box }) =>
        plan.tiles.some(
          (t) =>
            (t.x > box.x / PT + 0.01 && t.x < (box.x + box.width) / PT - 0.01) ||
            (t.y > box.y / PT + 0.01 && t.y < (box.y + box.height) / PT - 0.01),
        ),
      ).length;
    expect(cut(tilePlan(w, h, "A4"))).toBeGreaterThan(0);
    for (const sheet of ["A4", "A3", "LETTER"] as const) expect(cut(tilePlan(w, h, sheet, keep)), sheet).toBe(0);
  });

  for (const sheet of ["A4", "A3", "LETTER"] as const satisfies readonly TileSheet[]) {
    it(`${sheet}: every cell's figure is whole on some sheet, in its own cell`, { timeout: 60_000 }, async () => {
      const pdf = await printEdition(input, {
        format: "poster",
        tiles: sheet,
        band: null,
        sheetLabels: { title: snapshot.title, edition: 3, shortCode: "K7QM-2XHD", shortUrl: "x", checkUrl: "y" },
      });
      const plan = tilePlan(layout.page.width / PT, layout.page.height / PT, sheet, posterKeepWhole(layout, grids));
      const pages = pdfWords(pdf);
      expect(pages).toHaveLength(plan.tiles.length + 1);
      const m = TILE_MARGIN_MM * PT;
      const winW = plan.windowWidthMm * PT;
      const winH = plan.windowHeightMm * PT;
      // Words printed inside a sheet's window, placed back on the poster (pt from its top left).
      const whole = plan.tiles.flatMap((t, i) =>
        (pages[i + 1] ?? [])
          .filter((w) => w.xMin >= m - 0.5 && w.xMax <= m + winW + 0.5 && w.yMin >= m - 0.5 && w.yMax <= m + winH + 0.5)
          .map((w) => ({
            text: w.text,
            cx: (w.xMin + w.xMax) / 2 - m + t.x * PT,
            cy: (w.yMin + w.yMax) / 2 - m + t.y * PT,
          })),
      );
      const missing = figures.filter(
        ({ text, box }) =>
          !whole.some(
            (w) =>
              w.text === text && w.cx > box.x && w.cx < box.x + box.width && w.cy > box.y && w.cy < box.y + box.height,
          ),
      );
      expect(missing.map((f) => `${f.text}@${Math.round(f.box.x)},${Math.round(f.box.y)}`)).toEqual([]);
    });
  }
});
