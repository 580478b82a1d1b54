import { describe, expect, it } from "vitest";
import { snapshotGrids } from "@/lib/charts/snapshot";
import {
  CARD_HEAD_HEIGHT,
  CARD_HEAD_LINES,
  CARD_MIN_FIGURE_PT,
  CARD_PAGE,
  cardCoverage,
  cardFaces,
  cardGrid,
  cardSides,
  layoutCard,
  layoutCardKey,
} from "@/lib/poster/card";
import { CELL } from "@/lib/poster/layout";
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

describe("what the card says it shows", () => {
  const snapshot = snapshotOf(potDefinition);
  const full = snapshotGrids(snapshot)[0]!;

  it("names the rows and columns printed, and the chart's whole axes when it leaves some out", () => {
    // 7 x 7 values, 6 x 6 fit: the middle drops the last value of each axis.
    expect(cardCoverage(full, cardGrid(full, { lookup: 0 }))).toBe(
      "main 2.5-3.75 mm, side 2.0-3.25 mm of this chart (all of it: main 2.5-4.0, side 2.0-3.5 mm)",
    );
    const narrow = cardGrid(full, { lookup: 0, rows: [2.5, 3], cols: [2, 2.5] });
    expect(cardCoverage(narrow, narrow)).toBe("all of this chart: main 2.5-3.0 mm, side 2.0-2.5 mm");
  });

  it("prints exact diameters only where they reach the 20′ guide at 40 cm: on this card, nowhere", () => {
    const l = layoutCard(cardGrid(full, { lookup: 0 }));
    expect(l.figurePt).toBeGreaterThanOrEqual(CARD_MIN_FIGURE_PT - 1e-9);
    expect(l.figurePt * CELL.smallRatio).toBeLessThan(CARD_MIN_FIGURE_PT);
    expect(l.exact).toBe(false);
  });

  it("gives a one-lookup chart a key on the back; two lookups one each; a choice wins", () => {
    expect(cardFaces(snapshot)).toEqual([{ lookup: 0 }, "key"]);
    const side = { ...potDefinition.lookups[0], kind: "side", rounding: "down", familyId: 2 } as const;
    const two = snapshotOf({ ...potDefinition, lookups: [potDefinition.lookups[0], side] });
    expect(cardFaces(two)).toEqual([{ lookup: 0 }, { lookup: 1 }]);
    const chosen = snapshotOf({ ...potDefinition, card: { sides: [{ lookup: 0 }, { lookup: 0, rows: [3, 4] }] } });
    expect(cardFaces(chosen)).toEqual([{ lookup: 0 }, { lookup: 0, rows: [3, 4] }]);
  });

  it("lays the key face out on the card, its QR code clear of the words", () => {
    const k = layoutCardKey();
    for (const b of [k.head, k.body, k.qr, k.code, k.caution]) {
      expect(b.x).toBeGreaterThanOrEqual(0);
      expect(b.y + b.height).toBeLessThanOrEqual(CARD_PAGE.height + 1e-9);
      expect(b.x + b.width).toBeLessThanOrEqual(CARD_PAGE.width + 1e-9);
    }
    expect(k.body.x + k.body.width).toBeLessThan(k.qr.x);
    expect(k.code.y + k.code.height).toBeLessThanOrEqual(k.caution.y);
  });
});
