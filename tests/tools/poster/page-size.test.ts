import { describe, expect, it } from "vitest";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import type { PaperId } from "@/lib/poster/paper";
import { pdfInfo } from "@/tests/support/pdf-tools";
import { posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

// Portrait sizes in PDF points (1/72 in), typed from the standards rather than computed:
// ISO 216 A-series from millimetres, ASME Y14.1 US sizes from inches.
const EXPECTED: { paper: PaperId; standard: string; width: number; height: number }[] = [
  { paper: "A4", standard: "ISO 216 A4, 210 × 297 mm", width: 595.28, height: 841.89 },
  { paper: "A3", standard: "ISO 216 A3, 297 × 420 mm", width: 841.89, height: 1190.55 },
  { paper: "A2", standard: "ISO 216 A2, 420 × 594 mm", width: 1190.55, height: 1683.78 },
  { paper: "A1", standard: "ISO 216 A1, 594 × 841 mm", width: 1683.78, height: 2383.94 },
  { paper: "A0", standard: "ISO 216 A0, 841 × 1189 mm", width: 2383.94, height: 3370.39 },
  { paper: "LETTER", standard: "ASME Y14.1 Letter (ANSI A), 8.5 × 11 in", width: 612, height: 792 },
  { paper: "TABLOID", standard: "ASME Y14.1 Tabloid (ANSI B), 11 × 17 in", width: 792, height: 1224 },
  { paper: "ARCH-C", standard: "ASME Y14.1 ARCH C, 18 × 24 in", width: 1296, height: 1728 },
  { paper: "ARCH-D", standard: "ASME Y14.1 ARCH D, 24 × 36 in", width: 1728, height: 2592 },
];

const small = {
  ...potDefinition,
  lookups: [{ ...potDefinition.lookups[0], rows: [2.5, 3, 3.5], cols: [2, 2.5, 3] }],
};

describe("page size read back by pdfinfo", () => {
  for (const e of EXPECTED) {
    for (const orientation of ["portrait", "landscape"] as const) {
      it(`${e.standard}, ${orientation}: one page of the exact size`, { timeout: 30_000 }, async () => {
        const pdf = await renderPosterPdf(posterInput(snapshotOf({ ...small, paper: e.paper, orientation })));
        const info = pdfInfo(pdf);
        const [w, h] = orientation === "portrait" ? [e.width, e.height] : [e.height, e.width];
        expect(info.pages).toBe(1);
        expect(Math.abs(info.widthPt - w)).toBeLessThanOrEqual(0.01);
        expect(Math.abs(info.heightPt - h)).toBeLessThanOrEqual(0.01);
      });
    }
  }
});

describe("everything on one page", () => {
  const crowded = {
    ...potDefinition,
    notes: "N".repeat(600),
    lookups: [
      {
        kind: "proximal",
        rows: { from: 2, to: 4.9, step: 0.1 },
        cols: { from: 1.5, to: 4.4, step: 0.1 },
        rounding: "reach",
        familyId: 1,
      },
      {
        kind: "side",
        rows: { from: 2.5, to: 5.4, step: 0.1 },
        cols: { from: 2, to: 4.9, step: 0.1 },
        rounding: "down",
        familyId: 2,
      },
      {
        kind: "main",
        rows: { from: 2.5, to: 5.4, step: 0.1 },
        cols: { from: 1.5, to: 4.4, step: 0.1 },
        rounding: "nearest",
        familyId: 1,
      },
    ],
  } as const;
  for (const paper of ["A4", "A0"] as const) {
    it(`three 30 x 30 grids and 600 characters of notes fit one ${paper} page`, { timeout: 60_000 }, async () => {
      const pdf = await renderPosterPdf(
        posterInput(snapshotOf({ ...crowded, paper, orientation: "landscape" }), {
          status: "draft",
          approvedAt: null,
          approvedByName: null,
        }),
      );
      expect(pdfInfo(pdf).pages).toBe(1);
    });
  }
});
