import { describe, expect, it } from "vitest";
import { cellBox, layoutPoster, type Box, type LayoutInput } from "@/lib/poster/layout";
import { mmToPt, ORIENTATIONS, PAPER_IDS } from "@/lib/poster/paper";

const texts = { title: 60, law: 40, source: 160, notes: 600, caution: 250, legend: [110, 140, 150, 180, 130], url: 40 };
const input = (over: Partial<LayoutInput> & Pick<LayoutInput, "grids">): LayoutInput => ({
  paper: "A2",
  orientation: "portrait",
  texts,
  banner: true,
  logo: true,
  ...over,
});
const grid = (rows: number, cols: number, pressureLine = false) => ({
  rows,
  cols,
  pressureLine,
  titleChars: 52,
  subtitleLines: [60, 40, 50],
});

const EPS = 1e-6;
const overlaps = (a: Box, b: Box) =>
  a.x < b.x + b.width - EPS && b.x < a.x + a.width - EPS && a.y < b.y + b.height - EPS && b.y < a.y + a.height - EPS;
const inside = (inner: Box, outer: Box) =>
  inner.x >= outer.x - EPS &&
  inner.y >= outer.y - EPS &&
  inner.x + inner.width <= outer.x + outer.width + EPS &&
  inner.y + inner.height <= outer.y + outer.height + EPS;

describe("layoutPoster", () => {
  const shapes = [
    [grid(10, 12)],
    [grid(7, 7), grid(7, 7, true)],
    [grid(4, 30), grid(30, 4), grid(10, 10)],
    [grid(30, 30)],
    [grid(1, 1)],
  ];

  it("keeps every block on the page, inside the margins, with no two blocks overlapping", () => {
    for (const paper of PAPER_IDS) {
      for (const orientation of ORIENTATIONS) {
        for (const grids of shapes) {
          for (const banner of [true, false]) {
            const l = layoutPoster(input({ paper, orientation, grids, banner, logo: banner }));
            const label = `${paper} ${orientation} ${grids.length} grids ${l.footer}`;
            const page: Box = {
              x: l.margin,
              y: l.margin,
              width: l.page.width - 2 * l.margin,
              height: l.page.height - 2 * l.margin,
            };
            const blocks: [string, Box][] = [
              ["lab and title", l.title],
              ["law", l.law],
              ...(l.logo ? [["logo", l.logo] as [string, Box]] : []),
              ...(l.banner ? [["banner", l.banner] as [string, Box]] : []),
              ...l.grids.map((g, i) => [`grid ${i}`, g.box] as [string, Box]),
              ["caution", l.caution],
              ["legend", l.legend],
              ["edition", l.edition],
              ["qr", l.qr],
              ["qr text", l.qrText],
            ];
            for (const [name, b] of blocks) expect(inside(b, page), `${label}: ${name} inside the margins`).toBe(true);
            for (let i = 0; i < blocks.length; i++) {
              for (let j = i + 1; j < blocks.length; j++) {
                const [a, ba] = blocks[i] as [string, Box];
                const [b, bb] = blocks[j] as [string, Box];
                expect(overlaps(ba, bb), `${label}: ${a} overlaps ${b}`).toBe(false);
              }
            }
            for (const row of l.legendRows) {
              expect(inside(row.swatch, l.legend), `${label}: legend swatch`).toBe(true);
              expect(inside(row.text, l.legend), `${label}: legend text`).toBe(true);
            }
            l.grids.forEach((g, i) => {
              const { rows, cols } = grids[i] as ReturnType<typeof grid>;
              expect(inside(cellBox(g, rows - 1, cols - 1), g.box), `${label}: last cell inside grid ${i}`).toBe(true);
            });
            expect(l.figurePt, label).toBeGreaterThan(0);
          }
        }
      }
    }
  });

  it("draws the QR code at least 25 mm wide plus its quiet zone, larger on larger paper", () => {
    const side = (paper: (typeof PAPER_IDS)[number]) => layoutPoster(input({ paper, grids: [grid(10, 12)] })).qr.width;
    // The reserved square holds the symbol of the smallest version (21 modules) plus 4 modules each side.
    expect((side("A4") * 21) / 29).toBeGreaterThanOrEqual(mmToPt(25) - EPS);
    expect(side("A1")).toBeGreaterThan(side("A4"));
    expect(side("A0")).toBeGreaterThan(side("A1"));
  });

  it("gives larger figures on larger paper and smaller ones with more columns", () => {
    const f = (paper: (typeof PAPER_IDS)[number], cols = 12) =>
      layoutPoster(input({ paper, grids: [grid(10, cols)] })).figurePt;
    expect(f("A3")).toBeGreaterThan(f("A4"));
    expect(f("A2")).toBeGreaterThan(f("A3"));
    expect(f("A1")).toBeGreaterThan(f("A2"));
    expect(f("A0")).toBeGreaterThan(f("A1"));
    expect(f("A2", 24)).toBeLessThan(f("A2", 12));
  });

  it("moves the legend beside the grids when that gives larger figures on a wide page", () => {
    const wide = layoutPoster(input({ paper: "TABLOID", orientation: "landscape", grids: [grid(7, 7)] }));
    const tall = layoutPoster(input({ paper: "TABLOID", orientation: "portrait", grids: [grid(7, 7)] }));
    expect(wide.footer).toBe("side");
    expect(tall.footer).toBe("bottom");
  });

  it("refuses zero or more than three grids", () => {
    expect(() => layoutPoster(input({ grids: [] }))).toThrow(RangeError);
    expect(() => layoutPoster(input({ grids: [grid(2, 2), grid(2, 2), grid(2, 2), grid(2, 2)] }))).toThrow(RangeError);
  });
});
