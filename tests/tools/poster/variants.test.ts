// Every printed variant read back with poppler and zbarimg: the status bands, the archive copy,
// tiled office sheets and the badge card.
import { execFileSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { renderCardPdf, renderPosterPdf } from "@/lib/poster/pdf/render";
import { ARCHIVE_STAMP, NOT_CURRENT_BAND, stampBands, tilePoster } from "@/lib/poster/pdf/variants";
import { CARD_HEIGHT_MM, CARD_MIN_FIGURE_PT, cardCapacity } from "@/lib/poster/card";
import { tilePlan, TILE_OVERLAP_MM, TILE_SHEETS, type TileSheet } from "@/lib/poster/tiles";
import { cardHeadings } from "@/tests/support/card-headings";
import { withTempDir, zbarDecode } from "@/tests/support/pdf-tools";
import { posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const MM = 72 / 25.4;

/** pdftotext per page (layout order), as an operator's copy-paste would read each sheet. */
function pageTexts(pdf: Buffer): string[] {
  return withTempDir((dir) => {
    const file = path.join(dir, "v.pdf");
    writeFileSync(file, pdf);
    const out = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
    return out.split("\f").slice(0, -1);
  });
}

/** Every page's size from pdfinfo -f 1 -l N, in points. */
function pageSizes(pdf: Buffer): { w: number; h: number }[] {
  return withTempDir((dir) => {
    const file = path.join(dir, "v.pdf");
    writeFileSync(file, pdf);
    const out = execFileSync("pdfinfo", ["-f", "1", "-l", "9999", file], { encoding: "utf8" });
    return [...out.matchAll(/^Page\s+\d+ size:\s+([\d.]+) x ([\d.]+) pts/gm)].map((m) => ({
      w: Number(m[1]),
      h: Number(m[2]),
    }));
  });
}

function rasterPage(pdf: Buffer, page: number, dpi: number): Buffer {
  return withTempDir((dir) => {
    const file = path.join(dir, "v.pdf");
    writeFileSync(file, pdf);
    execFileSync("pdftoppm", [
      "-r",
      String(dpi),
      "-f",
      String(page),
      "-l",
      String(page),
      "-png",
      "-singlefile",
      file,
      path.join(dir, "p"),
    ]);
    return execFileSync("cat", [path.join(dir, "p.png")]);
  });
}

const snapshot = snapshotOf(potDefinition);
const input = posterInput(snapshot);

describe("status bands and the archive copy", () => {
  let poster: Buffer;
  beforeAll(async () => {
    poster = await renderPosterPdf(input);
  }, 60_000);

  it("prints NOT CURRENT - DO NOT POST with the date at the top and bottom of every page", async () => {
    const banded = await stampBands(poster, {
      kind: "not-current",
      date: "2026-12-02",
      reason: "a newer edition replaces this one",
    });
    const pages = pageTexts(banded);
    expect(pages).toHaveLength(1);
    for (const p of pages) {
      expect(p).toContain(`${NOT_CURRENT_BAND} 2026-12-02`);
      expect(p).toContain(`${NOT_CURRENT_BAND} 2026-12-02: a newer edition replaces this one`);
    }
    // The poster beneath is untouched: its figures still read back.
    expect(pages[0]).toContain("K7QM-2XHD");
    expect(pageTexts(poster)[0]).not.toContain(NOT_CURRENT_BAND);
  });

  it("stamps the archive copy as such, and never as not current", async () => {
    const archived = await stampBands(poster, { kind: "archive", date: "2026-12-02" });
    const [p] = pageTexts(archived);
    expect(p).toContain(`${ARCHIVE_STAMP} 2026-12-02`);
    expect(p).toContain("not for posting");
    expect(p).not.toContain(NOT_CURRENT_BAND);
  });

  it("is deterministic: the same band gives the same bytes", async () => {
    const band = { kind: "archive", date: "2026-12-02" } as const;
    expect(Buffer.compare(await stampBands(poster, band), await stampBands(poster, band))).toBe(0);
  });
});

describe("tiled printing on office sheets", () => {
  let poster: Buffer;
  beforeAll(async () => {
    poster = await renderPosterPdf(input);
  }, 60_000);

  // Portrait sizes typed from the standards: ISO 216 in mm, ANSI in inches.
  const SHEETS: Record<TileSheet, [number, number]> = {
    A4: [595.28, 841.89],
    A3: [841.89, 1190.55],
    LETTER: [612, 792],
    TABLOID: [792, 1224],
  };

  for (const sheet of TILE_SHEETS) {
    it(
      `${sheet}: exact sheet sizes, labels that match the assembly map, the code on every sheet`,
      { timeout: 60_000 },
      async () => {
        const pdf = await tilePoster(poster, {
          sheet,
          title: snapshot.title,
          edition: 3,
          shortCode: "K7QM-2XHD",
          shortUrl: "forkwall.example/c/K7QM-2XHD",
          checkUrl: input.edition.checkUrl,
          band: null,
        });
        const sizes = pageSizes(pdf);
        const plan = tilePlan(420, 594, sheet);
        expect(sizes).toHaveLength(plan.tiles.length + 1);
        const [pw, ph] = SHEETS[sheet];
        const [w, h] = plan.orientation === "portrait" ? [pw, ph] : [ph, pw];
        for (const s of sizes) {
          expect(Math.abs(s.w - w)).toBeLessThanOrEqual(0.01);
          expect(Math.abs(s.h - h)).toBeLessThanOrEqual(0.01);
        }
        // Fewer sheets than the other orientation would need (or as few).
        const other = tilePlan(420, 594, sheet);
        expect(plan.tiles.length).toBeLessThanOrEqual(other.tiles.length);
        const texts = pageTexts(pdf);
        const map = texts[0] as string;
        expect(map).toContain("Assembly map");
        expect(map).toContain(`${plan.tiles.length} sheets at 100 %`);
        const last = plan.tiles[plan.tiles.length - 1]!.label;
        texts.slice(1).forEach((t, i) => {
          const label = plan.tiles[i]!.label;
          expect(map).toMatch(new RegExp(`\\b${label}\\b`));
          expect(t).toContain(`Sheet ${label} of ${last}`);
          expect(t).toContain("K7QM-2XHD");
        });
        // The labels on the map are exactly the sheets: no more.
        const onMap = new Set(
          [...map.matchAll(/\b([A-Z]{1,2}[0-9]{1,2})\b/g)]
            .map((m) => m[1])
            .filter((l) => l !== "A2" || plan.tiles.some((t) => t.label === "A2")),
        );
        for (const l of onMap) if (/^[A-Z][0-9]$/.test(l!)) expect(plan.tiles.map((t) => t.label)).toContain(l);
      },
    );
  }

  it("covers the poster with 10 mm overlaps at 100 % scale", () => {
    const plan = tilePlan(594, 841, "A4");
    const stepX = plan.windowWidthMm - TILE_OVERLAP_MM;
    const right = plan.tiles.reduce((m, t) => Math.max(m, t.x + t.width), 0);
    const bottom = plan.tiles.reduce((m, t) => Math.max(m, t.y + t.height), 0);
    expect(right).toBeGreaterThanOrEqual(594 - 1e-6);
    expect(bottom).toBeGreaterThanOrEqual(841 - 1e-6);
    expect(plan.tiles[0]!.x).toBeLessThanOrEqual(0);
    expect(plan.tiles[1]!.x - plan.tiles[0]!.x).toBeCloseTo(stepX, 6);
  });

  it("the sheet holding the QR code decodes to the check address", { timeout: 60_000 }, async () => {
    const pdf = await tilePoster(poster, {
      sheet: "A4",
      title: snapshot.title,
      edition: 3,
      shortCode: "K7QM-2XHD",
      shortUrl: "forkwall.example/c/K7QM-2XHD",
      checkUrl: input.edition.checkUrl,
      band: null,
    });
    const texts = pageTexts(pdf);
    let decoded: string[] = [];
    for (let i = 2; i <= texts.length && decoded.length === 0; i++) {
      try {
        decoded = zbarDecode(rasterPage(pdf, i, 150));
      } catch {
        decoded = [];
      }
    }
    expect(decoded).toContain(input.edition.checkUrl);
    // The assembly map carries the check code too: the poster's own can fall across two sheets.
    expect(zbarDecode(rasterPage(pdf, 1, 150))).toContain(input.edition.checkUrl);
  });
});

describe("the badge card", () => {
  let card: Buffer;
  beforeAll(async () => {
    card = await renderCardPdf(input);
  }, 60_000);

  it("is two pages of ISO/IEC 7810 ID-1, 85.60 x 53.98 mm", () => {
    const sizes = pageSizes(card);
    expect(sizes).toHaveLength(2);
    for (const s of sizes) {
      expect(Math.abs(s.w - 85.6 * MM)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(s.h - CARD_HEIGHT_MM * MM)).toBeLessThanOrEqual(0.01);
    }
  });

  it("carries the short code, the dates and the caution on each side; the lookup on the front only", () => {
    const texts = pageTexts(card);
    for (const t of texts) {
      expect(t).toContain("K7QM-2XHD");
      expect(t).toContain("CAUTION.");
      expect(t).toContain("Edition 3");
      expect(t).toContain("Approved 2026-03-02");
      expect(t).toContain("Review by 2027-03-02");
    }
    expect(texts[0]).toContain("POT balloon (parent)");
    // One lookup: the back is the key, not the same table again.
    expect(texts[1]).not.toContain("POT balloon (parent) from");
    expect(texts[1]).toContain("Stent limit.");
  });

  it("says which rows and columns it prints, of how many", () => {
    const [front, back] = pageTexts(card).map((t) => t.replace(/\s+/g, " "));
    const covers = "main 2.5-3.75 mm, side 2.0-3.25 mm of this chart (all of it: main 2.5-4.0, side 2.0-3.5 mm)";
    expect(front).toContain(`Shows ${covers}`);
    expect(back).toContain(`The other side shows ${covers}`);
  });

  it("leaves out exact diameters, too small to read at 40 cm", () => {
    const [front] = pageTexts(card);
    expect(front).toMatch(/\b3\.75\b/);
    expect(front).not.toMatch(/\(\d\.\d\d\)/);
    expect(front).toContain("exact diameters on the poster");
  });

  it("narrows the grid to what stays legible at 40 cm", () => {
    const cap = cardCapacity(false);
    expect(cap.rows).toBeGreaterThanOrEqual(3);
    expect(cap.cols).toBeGreaterThanOrEqual(3);
    // 20′ at 0.4 m is 2.33 mm of figure height: Inter's figures are 0.7275 of the size.
    expect(CARD_MIN_FIGURE_PT).toBeCloseTo(((2 * 400 * Math.tan(((20 / 60) * Math.PI) / 360)) / (1490 / 2048)) * MM, 3);
  });

  it("has a QR code on each side that decodes to the check page", () => {
    expect(zbarDecode(rasterPage(card, 1, 600))).toContain(input.edition.checkUrl);
    expect(zbarDecode(rasterPage(card, 2, 300))).toContain(input.edition.checkUrl);
  });

  it("gets the NOT CURRENT band on both sides when stamped", async () => {
    const banded = await stampBands(card, { kind: "not-current", date: "2026-12-02", reason: "withdrawn" });
    for (const t of pageTexts(banded)) expect(t).toContain(`${NOT_CURRENT_BAND} 2026-12-02`);
  });
});

describe("a badge card whose sides the designer chose", () => {
  // Side 1: the POT lookup's whole axes (7 x 7, more than fit); side 2: the side-branch lookup,
  // rows (parent) 3.25-3.75 of 3.0-4.5 and columns (main branch) 2.75-3.25 of 2.5-4.0.
  const chosen = snapshotOf({
    ...potDefinition,
    lookups: [
      potDefinition.lookups[0],
      {
        kind: "side",
        rows: { from: 3, to: 4.5, step: 0.25 },
        cols: { from: 2.5, to: 4, step: 0.25 },
        rounding: "down",
        familyId: 2,
      },
    ],
    card: { sides: [{ lookup: 0 }, { lookup: 1, rows: [3.25, 3.75], cols: [2.75, 3.25] }] },
  });
  let card: Buffer;
  beforeAll(async () => {
    card = await renderCardPdf(posterInput(chosen));
  }, 60_000);

  it("prints the chosen lookup on side 2 with exactly the chosen rows and columns", () => {
    const texts = pageTexts(card);
    expect(texts).toHaveLength(2);
    expect(texts[1]).toContain("Side-branch balloon from parent × main branch");
    expect(texts[1]).not.toContain("POT balloon (parent)");
    const [, back] = cardHeadings(card, chosen);
    expect(back).toEqual({ rows: ["3.25", "3.5", "3.75"], cols: ["2.75", "3.0", "3.25"] });
  });

  it("prints the middle of an axis wider than fits on side 1", () => {
    const texts = pageTexts(card);
    expect(texts[0]).toContain("POT balloon (parent)");
    const [front] = cardHeadings(card, chosen);
    const cap = cardCapacity(false);
    // 7 values each way, 6 fit: the middle 6 drops the last value (the odd one goes above).
    expect(cap).toEqual({ rows: 6, cols: 6 });
    expect(front).toEqual({
      rows: ["2.5", "2.75", "3.0", "3.25", "3.5", "3.75"],
      cols: ["2.0", "2.25", "2.5", "2.75", "3.0", "3.25"],
    });
  });

  it("without a choice, a one-lookup chart prints lookup 1 on the front and the key on the back", async () => {
    const plain = snapshotOf(potDefinition);
    const [front, back] = cardHeadings(await renderCardPdf(posterInput(plain)), plain);
    expect(back).toBeNull();
    expect(front!.cols).toEqual(["2.0", "2.25", "2.5", "2.75", "3.0", "3.25"]);
  }, 60_000);

  it("a two-lookup card says on each side what it covers, with the dates", () => {
    const texts = pageTexts(card).map((t) => t.replace(/\s+/g, " "));
    expect(texts[1]).toContain(
      "Shows parent 3.25-3.75 mm, main 2.75-3.25 mm of this chart (all of it: parent 3.0-4.5, main 2.5-4.0 mm)",
    );
    for (const t of texts) expect(t).toContain("Review by 2027-03-02");
    expect(zbarDecode(rasterPage(card, 2, 600))).toContain(posterInput(chosen).edition.checkUrl);
  });
});
