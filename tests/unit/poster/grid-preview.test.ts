import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { GridPreview } from "@/components/poster/grid-preview";
import { gridJson } from "@/lib/charts/grid-model";
import { snapshotGrids } from "@/lib/charts/snapshot";
import type { GridMark } from "@/lib/sizing";
import { CAUTION_TEXT } from "@/lib/cautions";
import { cellView, MARKS, PALETTE } from "@/lib/poster/marks";
import { potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const snapshot = snapshotOf(potDefinition);
const [grid] = snapshotGrids(snapshot);
const html = renderToStaticMarkup(
  createElement(GridPreview, { grid: grid!, family: snapshot.lookups[0]!.family, stentName: snapshot.stent!.name }),
);
const decode = (s: string) =>
  s
    .replace(/&quot;/g, '"')
    .replace(/&#x27;/g, "'")
    .replace(/&amp;/g, "&")
    .replace(/&gt;/g, ">")
    .replace(/&lt;/g, "<");
const text = decode(html);

describe("GridPreview (HTML)", () => {
  it("is a real table with a caption and scoped row and column headers", () => {
    expect(html.match(/<table/g)).toHaveLength(1);
    expect(text).toMatch(/<caption[^>]*>.*POT balloon \(parent\) from main branch × side branch/);
    const colHeads = html.match(/<th scope="col"/g) ?? [];
    const rowHeads = html.match(/<th scope="row"/g) ?? [];
    expect(colHeads).toHaveLength(grid!.colAxis.values.length + 1);
    expect(rowHeads).toHaveLength(grid!.rowAxis.values.length);
    expect(html.match(/<td/g)).toHaveLength(grid!.cells.flat().length);
  });

  it("puts every cell in words for screen readers and as a hover title", () => {
    for (const cell of grid!.cells.flat()) {
      const v = cellView(cell);
      expect(text).toContain(`title="${v.description}"`);
      expect(text).toContain(`<span class="sr-only">${v.description}</span>`);
    }
  });

  it("draws the poster's marks: same symbols, backgrounds, hatching and heavy border", () => {
    expect(text).toContain(`background-color:${MARKS.noSize.background}`);
    expect(text).toContain(`repeating-linear-gradient(135deg, ${PALETTE.hatch}`);
    expect(text).toContain(`background-color:${MARKS.hazard.background}`);
    expect(text).toContain(`box-shadow:inset 0 0 0 3px ${PALETTE.ink}`);
    expect(text).toContain(`data-marks="noStock hazard"`);
    expect(text).toContain(">▲<");
    expect(text).toContain("■");
    expect(text).toContain("◇");
  });

  it("carries the legend in words and the clinical caution", () => {
    for (const s of [
      "How to read a cell",
      "No size.",
      "No stocked size.",
      "Stent limit.",
      "Outside published fit.",
      "Illustrative DES",
    ])
      expect(text).toContain(s);
    expect(text).toContain(CAUTION_TEXT);
  });
});

describe("the designer preview agrees with the grid API cell for cell", () => {
  it("prints each cell's size label, exact label, pressure and marks as gridJson answers them", () => {
    const json = gridJson(snapshot).lookups[0]!;
    const tds = [...html.matchAll(/<td([^>]*)>(.*?)<\/td>/g)].map(([, attrs, inner]) => [
      "",
      /data-marks="([^"]*)"/.exec(attrs!)?.[1],
      inner,
    ]);
    expect(tds).toHaveLength(json.cells.flat().length);
    const MARK_NAMES: Record<string, GridMark[]> = {
      noSize: ["not-bifurcation"],
      hazard: ["stent-limit"],
      oversize: ["oversize"],
      undersize: ["undersize"],
      outsideFit: ["outside-fit"],
    };
    json.cells.flat().forEach((cell, k) => {
      const [, marksAttr, inner] = tds[k]!;
      const spans = [...decode(inner!).matchAll(/<span class="block text-xl font-bold leading-none">([^<]*)<\/span>/g)];
      const primary = spans[0]![1];
      const previewMarks = (marksAttr ?? "")
        .split(" ")
        .filter(Boolean)
        .flatMap((m) => (m === "noStock" ? cell.marks.filter((x) => x.endsWith("-stock")) : (MARK_NAMES[m] ?? [])));
      expect(previewMarks, `cell ${k}`).toEqual(cell.marks);
      if (cell.sizeLabel !== null) expect(primary).toBe(cell.sizeLabel);
      if (cell.exactLabel !== null && cell.sizeLabel !== null) expect(decode(inner!)).toContain(`(${cell.exactLabel})`);
      if (cell.atm !== null) expect(decode(inner!)).toContain(`@ ${cell.atm} atm`);
    });
    expect(json.cells.flat().some((c) => c.marks.includes("oversize"))).toBe(true);
    expect(json.cells.flat().some((c) => c.marks.includes("stent-limit"))).toBe(true);
  });
});
