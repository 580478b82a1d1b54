import QRCode from "qrcode";

/** Quiet zone each side, in modules (ISO/IEC 18004 asks for four). */
export const QR_QUIET_MODULES = 4;
/** Error correction M restores about 15% of damaged codewords: a scuffed wall poster still scans. */
export const QR_ERROR_CORRECTION = "M" as const;

export type QrRect = { x: number; y: number; width: number; height: number };
export type QrSymbol = {
  /** Modules per side, without the quiet zone. */
  size: number;
  version: number;
  /** Dark modules as rectangles in module units (one per horizontal run), origin at the symbol's corner. */
  rects: QrRect[];
};

/** The QR symbol for `text` as vector rectangles, from the qrcode package's module matrix. */
export function qrSymbol(text: string): QrSymbol {
  const code = QRCode.create(text, { errorCorrectionLevel: QR_ERROR_CORRECTION });
  const { size, data } = code.modules;
  const rects: QrRect[] = [];
  for (let y = 0; y < size; y++) {
    let x = 0;
    while (x < size) {
      if (!data[y * size + x]) {
        x++;
        continue;
      }
      const start = x;
      while (x < size && data[y * size + x]) x++;
      rects.push({ x: start, y, width: x - start, height: 1 });
    }
  }
  return { size, version: code.version, rects };
}

/** An SVG path of the dark modules in module units, offset by the quiet zone. */
export function qrPath(symbol: QrSymbol): string {
  const q = QR_QUIET_MODULES;
  return symbol.rects.map((r) => `M${r.x + q} ${r.y + q}h${r.width}v1h${-r.width}z`).join("");
}
