// The grids fill the page: for every paper size and orientation and each demo chart, no empty
// band taller than one cell between header, grids and footer, and the grids' share of the
// printable area is measured (and printed, to compare layouts).
import { describe, expect, it } from "vitest";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { layoutPoster, type Box } from "@/lib/poster/layout";
import { layoutInputFor } from "@/lib/poster/model";
import { ORIENTATIONS, PAPER_IDS } from "@/lib/poster/paper";
import { snapshotOf } from "@/tests/support/poster-fixtures";

const ids = { nc: 1, sc: 2, stent: 7 };
const bottomOf = (b: Box) => b.y + b.height;

describe("the grids fill the page", () => {
  for (const chart of DEMO_CHARTS) {
    it(`${chart.title}: every paper and orientation`, () => {
      const shares: string[] = [];
      for (const paper of PAPER_IDS)
        for (const orientation of ORIENTATIONS) {
          const def = { ...(chart.definition(ids) as object), paper, orientation };
          const snapshot = snapshotOf(def as never);
          const l = layoutPoster(layoutInputFor(snapshot, { status: "approved" }));
          const label = `${paper} ${orientation}`;
          const cell = Math.min(...l.grids.map((g) => g.cellHeight));
          const top = Math.min(...l.grids.map((g) => g.box.y));
          const gridsBottom = Math.max(...l.grids.map((g) => bottomOf(g.box)));
          const headerBottom = bottomOf(l.banner ?? l.header);
          // Between the header and the first grid: the layout's gap plus at most one cell.
          expect(top - headerBottom, `${label}: band above the grids`).toBeLessThanOrEqual(cell + 1e-6 + 20 * l.scale);
          const footerTop = l.footer === "bottom" ? Math.min(l.legend.y, l.edition.y, l.qr.y) : l.caution.y;
          expect(footerTop - gridsBottom, `${label}: band below the grids`).toBeLessThanOrEqual(
            cell + 1e-6 + 20 * l.scale,
          );
          const printable = (l.page.width - 2 * l.margin) * (l.page.height - 2 * l.margin);
          const share = l.grids.reduce((a, g) => a + g.box.width * g.box.height, 0) / printable;
          // Small sheets lose more to the labels sized for the reading distance; the chart's own paper
          // (the one it is approved on) gives the grids at least 40 %.
          expect(share, `${label}: grid share`).toBeGreaterThan(0.2);
          const own = chart.definition(ids) as { paper: string; orientation: string };
          if (own.paper === paper && own.orientation === orientation)
            expect(share, `${label} (the chart's own paper): grid share`).toBeGreaterThan(0.4);
          shares.push(`${label} ${(share * 100).toFixed(0)}%`);
        }
      console.log(`${chart.title}: grid share of the printable area: ${shares.join(", ")}`);
    });
  }
});
