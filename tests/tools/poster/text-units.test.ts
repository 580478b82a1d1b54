// Words that must read as a unit on the A1 poster, read back with pdftotext -bbox: the law's
// formula is never broken inside an expression, and each legend entry fits in three lines.
import { beforeAll, describe, expect, it } from "vitest";
import { posterModel } from "@/lib/poster/pdf/document";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import { pdfWords, type PdfWord } from "@/tests/support/pdf-tools";
import { kissingDefinition, posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

/** The words' lines, top to bottom: words whose vertical centres lie within half a line of each other. */
function lines(words: PdfWord[]): PdfWord[][] {
  const out: PdfWord[][] = [];
  for (const w of [...words].sort((a, b) => a.yMin - b.yMin || a.xMin - b.xMin)) {
    const c = (w.yMin + w.yMax) / 2;
    const line = out.find((l) => Math.abs((l[0]!.yMin + l[0]!.yMax) / 2 - c) < (w.yMax - w.yMin) / 2);
    if (line) line.push(w);
    else out.push([w]);
  }
  return out.map((l) => l.sort((a, b) => a.xMin - b.xMin));
}

const inside = (w: PdfWord, b: { x: number; y: number; width: number; height: number }) => {
  const cx = (w.xMin + w.xMax) / 2;
  const cy = (w.yMin + w.yMax) / 2;
  return cx >= b.x && cx <= b.x + b.width && cy >= b.y && cy <= b.y + b.height;
};

for (const [name, definition] of [
  ["POT, Finet", potDefinition],
  ["kissing, square law", kissingDefinition],
] as const) {
  describe(`the A1 ${name} poster's text units`, () => {
    const input = posterInput(snapshotOf({ ...definition, paper: "A1", orientation: "portrait" }));
    const { layout, legend } = posterModel(input);
    let words: PdfWord[] = [];
    beforeAll(async () => {
      words = pdfWords(await renderPosterPdf(input))[0] ?? [];
    }, 60_000);

    it("prints each legend entry in at most three lines", () => {
      expect(legend.length).toBeGreaterThan(1);
      legend.forEach((e, i) => {
        const row = layout.legendRows[i]!;
        const n = lines(words.filter((w) => inside(w, row.text))).length;
        expect(n, e.label).toBeGreaterThan(0);
        expect(n, e.label).toBeLessThanOrEqual(3);
      });
    });

    it("never breaks the formula inside an expression: only right after its '='", () => {
      const law = lines(words.filter((w) => inside(w, layout.law)));
      const text = law.map((l) => l.map((w) => w.text).join(" "));
      const start = text.findIndex((t) => /\bDp\b/.test(t));
      expect(start).toBeGreaterThanOrEqual(0);
      // The formula's lines: from the one naming Dp up to the one that closes it (ends in Dsb, an exponent or ")").
      const formula = text.slice(start).filter((t) => /D(p|mb|sb)/.test(t));
      for (const l of formula.slice(0, -1)) expect(l, text.join(" / ")).toMatch(/=$/);
      for (const l of formula) {
        expect((l.match(/\(/g) ?? []).length, l).toBe((l.match(/\)/g) ?? []).length);
        expect(l).not.toMatch(/^[+×=]/);
      }
    });
  });
}
