import { describe, expect, it } from "vitest";
import { posterModel } from "@/lib/poster/pdf/document";
import { renderPosterPdf } from "@/lib/poster/pdf/render";
import { ptToMm } from "@/lib/poster/paper";
import { QR_QUIET_MODULES } from "@/lib/poster/qr";
import { jsqrDecode, rasterise, zbarDecode } from "@/tests/support/pdf-tools";
import { posterInput, potDefinition, snapshotOf } from "@/tests/support/poster-fixtures";

const cases = [
  {
    name: "A4 portrait (smallest paper)",
    paper: "A4",
    orientation: "portrait",
    dpi: 150,
    url: "https://forkwall.example/c/7Qk2xB9m",
  },
  { name: "A2 portrait", paper: "A2", orientation: "portrait", dpi: 100, url: "https://forkwall.example/c/7Qk2xB9m" },
  {
    name: "Tabloid landscape, a longer URL",
    paper: "TABLOID",
    orientation: "landscape",
    dpi: 120,
    url: "https://check.forkwall.example/labs/illustrative-lab/c/7Qk2xB9mZp4Rt8Lw",
  },
] as const;

describe("the QR code decoded from the rasterised page", () => {
  for (const c of cases) {
    it(
      `${c.name}: jsQR and zbarimg both read the check URL; the symbol is at least 25 mm wide`,
      { timeout: 60_000 },
      async () => {
        const input = posterInput(snapshotOf({ ...potDefinition, paper: c.paper, orientation: c.orientation }), {
          checkUrl: c.url,
        });
        const pdf = await renderPosterPdf(input);
        const png = rasterise(pdf, c.dpi);

        const js = jsqrDecode(png);
        expect(js?.text).toBe(c.url);
        expect(zbarDecode(png)).toEqual([c.url]);

        // Width measured in the raster by the decoder's corners, and as drawn (modules x module size).
        const measuredMm = ((js?.widthPx ?? 0) / c.dpi) * 25.4;
        const { layout, qr } = posterModel(input);
        const moduleMm = ptToMm(layout.qr.width / (qr.size + 2 * QR_QUIET_MODULES));
        const drawnMm = moduleMm * qr.size;
        expect(drawnMm).toBeGreaterThanOrEqual(25);
        expect(measuredMm).toBeGreaterThanOrEqual(25 - 25.4 / c.dpi);
        expect(Math.abs(measuredMm - drawnMm)).toBeLessThan(drawnMm * 0.05);
      },
    );
  }
});
