// An edition that is not approved and current carries its state's stamp on every page of every
// printed form, read back as text (poppler and pdf.js) and as pixels (pdftoppm).
import { describe, expect, it } from "vitest";
import { PNG } from "pngjs";
import { STAMP_WORDS, type StampState } from "@/lib/poster/labels";
import { bandFor, printEdition, type PrintOptions } from "@/lib/poster/pdf/print";
import { pdfjsPageTexts, rasterise } from "@/tests/support/pdf-tools";
import { pageTexts } from "@/tests/support/pdf-pages";
import { posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const snapshot = snapshotOf({ ...potDefinition, paper: "A1" });
const labels: PrintOptions["sheetLabels"] = {
  title: snapshot.title,
  edition: 3,
  shortCode: "K7QM-2XHD",
  shortUrl: "forkwall.example/c/K7QM-2XHD",
  checkUrl: posterInput(snapshot).edition.checkUrl,
};

const count = (text: string, words: string) => text.split(words).length - 1;

/** How much redder than grey the page is along its diagonal through the centre (pdftoppm, 20 dpi). */
function diagonalRedness(pdf: Buffer): number {
  const png = PNG.sync.read(rasterise(pdf, 20));
  let sum = 0;
  for (let k = 0.3; k <= 0.7; k += 0.02) {
    const x = Math.floor(png.width * k);
    const y = Math.floor(png.height * (1 - k));
    const i = (y * png.width + x) * 4;
    sum += (png.data[i] as number) - ((png.data[i + 1] as number) + (png.data[i + 2] as number)) / 2;
  }
  return sum / 21;
}

const CASES: { state: StampState; status: "draft" | "returned" | "withdrawn" | "superseded" }[] = [
  { state: "draft", status: "draft" },
  { state: "returned", status: "returned" },
  { state: "withdrawn", status: "withdrawn" },
  { state: "superseded", status: "superseded" },
];

describe("the stamp of an edition that must not be posted", () => {
  for (const { state, status } of CASES) {
    const words = STAMP_WORDS[state];
    const input = posterInput(
      snapshot,
      status === "draft" || status === "returned" ? { status, approvedAt: null } : { status },
    );
    const band = bandFor(state, "2026-12-02");

    it(`${state}: "${words}" across the poster, as text and as ink`, { timeout: 60_000 }, async () => {
      const pdf = await printEdition(input, { format: "poster", band, sheetLabels: labels });
      const [poppler] = pageTexts(pdf);
      expect(poppler).toContain(words);
      // Top band, bottom band and the diagonal, each one run of text.
      const [pdfjs] = await pdfjsPageTexts(pdf);
      expect(count(pdfjs as string, words)).toBe(3);
      const bare = await printEdition(input, { format: "poster", band: null, sheetLabels: labels });
      expect(diagonalRedness(pdf) - diagonalRedness(bare)).toBeGreaterThan(15);
    });

    it(`${state}: on the badge card's two sides`, { timeout: 60_000 }, async () => {
      const pdf = await printEdition(input, { format: "card", band, sheetLabels: labels });
      const pdfjs = await pdfjsPageTexts(pdf);
      expect(pdfjs).toHaveLength(2);
      for (const t of pdfjs) expect(count(t, words)).toBe(3);
      for (const t of pageTexts(pdf)) expect(t).toContain(words);
    });
  }

  it("draft: on every A4 sheet and the assembly map, with the diagonal on each", { timeout: 60_000 }, async () => {
    const input = posterInput(snapshot, { status: "draft", approvedAt: null });
    const pdf = await printEdition(input, {
      format: "poster",
      tiles: "A4",
      band: bandFor("draft", "x"),
      sheetLabels: labels,
    });
    const pdfjs = await pdfjsPageTexts(pdf);
    expect(pdfjs.length).toBeGreaterThan(4);
    // Top band and diagonal: the bottom margin keeps the sheet's label.
    for (const t of pdfjs) expect(count(t, STAMP_WORDS.draft)).toBe(2);
    for (const t of pageTexts(pdf, "raw")) expect(t).toContain(STAMP_WORDS.draft);
  });

  it("an approved, current edition carries none", { timeout: 60_000 }, async () => {
    expect(bandFor("current", "2026-12-02")).toBeNull();
    const pdf = await printEdition(posterInput(snapshot), { format: "poster", band: null, sheetLabels: labels });
    const [t] = await pdfjsPageTexts(pdf);
    for (const words of Object.values(STAMP_WORDS)) expect(t).not.toContain(words);
  });
});
