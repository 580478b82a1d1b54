import { Font } from "@react-pdf/renderer";
import { beforeAll, describe, expect, it } from "vitest";
import { POSTER_FONT, preparePosterFonts } from "@/lib/poster/pdf/document";

type Position = { xAdvance: number; yAdvance: number; xOffset: number; yOffset: number };
type Run = { glyphs: { id: number }[]; positions: Position[]; advanceWidth: number };
type LayoutFont = { layout(text: string, features?: string[]): Run };

describe("the shaping cache on react-pdf's own fonts", () => {
  let font: LayoutFont;
  beforeAll(async () => {
    await preparePosterFonts();
    font = Font.getFont({ fontFamily: POSTER_FONT, fontWeight: 400 }).data as unknown as LayoutFont;
  });

  it("is installed on the class of the font react-pdf loaded", () => {
    expect((Object.getPrototypeOf(font) as { layout: { name: string } }).layout.name).toBe("cachedLayout");
  });

  it("hands each caller its own run, so a caller that scales positions in place spoils nothing", () => {
    const first = font.layout("(3.05) 3.25", ["tnum"]);
    const advances = first.positions.map((p) => p.xAdvance);
    const width = first.advanceWidth;
    expect(advances.length).toBe(11);
    // What pdfkit does to a run it draws: every position scaled to its 1000-unit em.
    for (const p of first.positions) p.xAdvance *= 1000 / 2048;
    const again = font.layout("(3.05) 3.25", ["tnum"]);
    expect(again).not.toBe(first);
    expect(again.positions.map((p) => p.xAdvance)).toEqual(advances);
    expect(again.advanceWidth).toBe(width);
    expect(again.glyphs.map((g) => g.id)).toEqual(first.glyphs.map((g) => g.id));
  });

  it("keys runs by their features: tabular figures differ from proportional ones", () => {
    const tabular = font.layout("1111", ["tnum"]).advanceWidth;
    const proportional = font.layout("1111").advanceWidth;
    // Inter's tabular "1" is wider than its proportional one (font data; checked by this assertion).
    expect(tabular).not.toBe(proportional);
    expect(font.layout("1111", ["tnum"]).advanceWidth).toBe(tabular);
  });
});
