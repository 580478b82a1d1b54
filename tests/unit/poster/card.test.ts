import { describe, expect, it } from "vitest";
import { snapshotGrids } from "@/lib/charts/snapshot";
import { CARD_HEAD_HEIGHT, CARD_HEAD_LINES, CARD_PAGE, cardGrid, cardSides, layoutCard } from "@/lib/poster/card";
import { potDefinition, snapshotOf } from "../../support/poster-fixtures";

describe("badge card layout", () => {
  const snapshot = snapshotOf(potDefinition);
  const grid = cardGrid(snapshotGrids(snapshot)[0]!, cardSides(snapshot)[0]);
  const l = layoutCard(grid);

  it("keeps the head's two lines clear of the grid below them", () => {
    const lines =
      CARD_HEAD_LINES.title.fontSize * CARD_HEAD_LINES.title.lineHeight +
      CARD_HEAD_LINES.detail.fontSize * CARD_HEAD_LINES.detail.lineHeight;
    expect(l.head.height).toBe(CARD_HEAD_HEIGHT);
    expect(lines).toBeLessThanOrEqual(l.head.height);
    // The grid's column headings start below the head.
    expect(l.head.y + l.head.height).toBeLessThanOrEqual(l.grid.cellsY - l.grid.colHeadHeight);
  });

  it("stays on the ID-1 page (ISO/IEC 7810: 85.60 x 53.98 mm)", () => {
    for (const b of [l.head, l.qr, l.code, l.key, l.caution]) {
      expect(b.x).toBeGreaterThanOrEqual(0);
      expect(b.y).toBeGreaterThanOrEqual(0);
      expect(b.x + b.width).toBeLessThanOrEqual(CARD_PAGE.width + 1e-9);
      expect(b.y + b.height).toBeLessThanOrEqual(CARD_PAGE.height + 1e-9);
    }
  });
});
