import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { layoutPoster } from "@/lib/poster/layout";
import {
  FIGURE_HEIGHT_EM,
  figureHeightMm,
  maxReadingDistanceM,
  posterLegibility,
  requiredHeightMm,
  subtendedArcmin,
} from "@/lib/poster/legibility";
import { layoutInputFor, snapshotLegibility } from "@/lib/poster/model";
import { potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

/** Reads a big-endian TrueType table directory by hand: an independent look at the font file. */
function fontTable(file: string, tag: string): Buffer {
  const buf = readFileSync(file);
  const numTables = buf.readUInt16BE(4);
  for (let i = 0; i < numTables; i++) {
    const rec = 12 + i * 16;
    if (buf.toString("latin1", rec, rec + 4) === tag) {
      const offset = buf.readUInt32BE(rec + 8);
      const length = buf.readUInt32BE(rec + 12);
      return buf.subarray(offset, offset + length);
    }
  }
  throw new Error(`${tag} table missing in ${file}`);
}

describe("20 minutes of arc", () => {
  it("needs 5.82 mm at 1 m and 11.64 mm at 2 m (h = 2·d·tan(θ/2))", () => {
    expect(requiredHeightMm(1)).toBeCloseTo(5.818, 3);
    expect(requiredHeightMm(2)).toBeCloseTo(11.636, 3);
    expect(requiredHeightMm(1.5)).toBeCloseTo(8.727, 3);
  });

  it("inverts: a height subtends the angle it was made for, and the farthest distance follows", () => {
    expect(subtendedArcmin(requiredHeightMm(3), 3)).toBeCloseTo(20, 9);
    expect(subtendedArcmin(5.818, 1)).toBeCloseTo(20, 2);
    expect(maxReadingDistanceM(11.636)).toBeCloseTo(2, 3);
  });
});

describe("figure height from the font file", () => {
  it("uses Inter's OS/2 cap height over units per em, read from every weight shipped", () => {
    for (const weight of ["Regular", "SemiBold", "Bold"]) {
      const file = path.join(process.cwd(), "fonts", `Inter-${weight}.ttf`);
      const unitsPerEm = fontTable(file, "head").readUInt16BE(18);
      const os2 = fontTable(file, "OS/2");
      expect(os2.readUInt16BE(0)).toBeGreaterThanOrEqual(2); // sCapHeight exists from version 2
      const capHeight = os2.readInt16BE(88);
      expect(capHeight / unitsPerEm).toBeCloseTo(FIGURE_HEIGHT_EM, 9);
    }
  });

  it("converts a figure size in points to its digit height in mm", () => {
    // 72 pt = 1 inch = 25.4 mm of font size, of which 1490/2048 is the digit height.
    expect(figureHeightMm(72)).toBeCloseTo((25.4 * 1490) / 2048, 9);
  });
});

describe("poster legibility", () => {
  const snap = snapshotOf(potDefinition);

  it("passes the illustrative A2 POT chart at 1.5 m and suggests nothing", () => {
    const l = snapshotLegibility(snap);
    expect(l.ok).toBe(true);
    expect(l.suggestion).toBeNull();
    expect(l.figureHeightMm).toBeGreaterThan(l.requiredMm);
    expect(l.subtendedArcmin).toBeGreaterThan(20);
    expect(l.figureHeightMm).toBeCloseTo(figureHeightMm(layoutPoster(layoutInputFor(snap)).figurePt), 9);
  });

  it("fails a crowded A4 chart at 2 m, naming the smallest ISO paper and the most columns that pass", () => {
    const crowded = snapshotOf({
      ...potDefinition,
      paper: "A4",
      readingDistanceM: 2,
      lookups: [{ ...potDefinition.lookups[0], cols: { from: 2, to: 4.75, step: 0.25 } }],
    });
    const l = snapshotLegibility(crowded);
    expect(l.ok).toBe(false);
    expect(l.smallestPaper).not.toBeNull();
    expect(["A3", "A2", "A1", "A0"]).toContain(l.smallestPaper);
    // The suggested paper does pass, and the one below it does not.
    const papers = ["A4", "A3", "A2", "A1", "A0"] as const;
    const idx = papers.indexOf(l.smallestPaper as (typeof papers)[number]);
    const at = (paper: (typeof papers)[number]) =>
      posterLegibility({ ...layoutInputFor({ ...crowded, paper }), readingDistanceM: 2 });
    expect(at(papers[idx] as (typeof papers)[number]).ok).toBe(true);
    expect(at(papers[idx - 1] as (typeof papers)[number]).ok).toBe(false);
    expect(l.suggestion).toContain(`Use ${l.smallestPaper} or larger`);
    expect(l.suggestion).toContain("11.6 mm");
    if (l.maxColumns !== null) {
      expect(l.suggestion).toContain(`show at most ${l.maxColumns} column`);
      const input = layoutInputFor(crowded);
      const fewer = { ...input, grids: input.grids.map((g) => ({ ...g, cols: l.maxColumns as number })) };
      expect(posterLegibility({ ...fewer, readingDistanceM: 2 }).ok).toBe(true);
      const oneMore = { ...input, grids: input.grids.map((g) => ({ ...g, cols: (l.maxColumns as number) + 1 })) };
      expect(posterLegibility({ ...oneMore, readingDistanceM: 2 }).ok).toBe(false);
    }
  });

  it("keeps a US-paper chart in the US series", () => {
    const us = snapshotOf({ ...potDefinition, paper: "LETTER", readingDistanceM: 3 });
    const l = snapshotLegibility(us);
    expect(l.ok).toBe(false);
    expect(["TABLOID", "ARCH-C", "ARCH-D", null]).toContain(l.smallestPaper);
    expect(l.suggestion).toMatch(/read it from \d+\.\d m or closer/);
  });
});
