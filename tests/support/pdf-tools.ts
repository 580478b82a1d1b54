// Independent readers for rendered posters: poppler's pdfinfo/pdftoppm, pdf-parse, zbarimg, jsQR.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import jsQR from "jsqr";
import { PDFParse } from "pdf-parse";
import { PNG } from "pngjs";

export function withTempDir<T>(fn: (dir: string) => T): T {
  const dir = mkdtempSync(path.join(tmpdir(), "forkwall-poster-"));
  try {
    return fn(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** pdfinfo's page count and page size in points. */
export function pdfInfo(pdf: Buffer): { pages: number; widthPt: number; heightPt: number } {
  return withTempDir((dir) => {
    const file = path.join(dir, "p.pdf");
    writeFileSync(file, pdf);
    const out = execFileSync("pdfinfo", [file], { encoding: "utf8" });
    const pages = Number(/^Pages:\s+(\d+)/m.exec(out)?.[1]);
    const size = /^Page size:\s+([\d.]+) x ([\d.]+) pts/m.exec(out);
    if (!size) throw new Error(`pdfinfo printed no page size:\n${out}`);
    return { pages, widthPt: Number(size[1]), heightPt: Number(size[2]) };
  });
}

/** The page rasterised by pdftoppm at `dpi`, as a PNG file's bytes. */
export function rasterise(pdf: Buffer, dpi: number): Buffer {
  return withTempDir((dir) => {
    const file = path.join(dir, "p.pdf");
    writeFileSync(file, pdf);
    execFileSync("pdftoppm", ["-r", String(dpi), "-png", "-singlefile", file, path.join(dir, "page")]);
    return readFileSync(path.join(dir, "page.png"));
  });
}

/** How many images poppler's pdfimages finds in the PDF. */
export function pdfImages(pdf: Buffer): number {
  return withTempDir((dir) => {
    const file = path.join(dir, "p.pdf");
    writeFileSync(file, pdf);
    const out = execFileSync("pdfimages", ["-list", file], { encoding: "utf8" });
    return out
      .split("\n")
      .slice(2)
      .filter((l) => l.trim()).length;
  });
}

export function zbarDecode(png: Buffer): string[] {
  return withTempDir((dir) => {
    const file = path.join(dir, "page.png");
    writeFileSync(file, png);
    const out = execFileSync("zbarimg", ["-q", "--raw", file], {
      encoding: "utf8",
      stdio: ["ignore", "pipe", "ignore"],
    });
    return out.split("\n").filter(Boolean);
  });
}

export function jsqrDecode(png: Buffer) {
  const img = PNG.sync.read(png);
  const code = jsQR(
    new Uint8ClampedArray(img.data.buffer, img.data.byteOffset, img.data.length),
    img.width,
    img.height,
  );
  if (!code) return null;
  const { topLeftCorner: a, topRightCorner: b, bottomLeftCorner: c } = code.location;
  return { text: code.data, widthPx: Math.hypot(b.x - a.x, b.y - a.y), heightPx: Math.hypot(c.x - a.x, c.y - a.y) };
}

export async function pdfText(pdf: Buffer): Promise<{ text: string; info: Record<string, unknown> }> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const text = await parser.getText();
    const info = await parser.getInfo();
    return { text: text.text, info: (info.info ?? {}) as Record<string, unknown> };
  } finally {
    await parser.destroy();
  }
}

/** A word as poppler's pdftotext -bbox places it, in points from the page's top left. */
export type PdfWord = { text: string; xMin: number; yMin: number; xMax: number; yMax: number };

/** Every page's words with their boxes (pdftotext -bbox). */
export function pdfWords(pdf: Buffer): PdfWord[][] {
  const xml = withTempDir((dir) => {
    const file = path.join(dir, "p.pdf");
    writeFileSync(file, pdf);
    return execFileSync("pdftotext", ["-bbox", file, "-"], { encoding: "utf8" });
  });
  const unescape = (t: string) =>
    t
      .replace(/&lt;/g, "<")
      .replace(/&gt;/g, ">")
      .replace(/&quot;/g, '"')
      .replace(/&apos;/g, "'")
      .replace(/&amp;/g, "&");
  return xml
    .split(/<page /)
    .slice(1)
    .map((page) =>
      [...page.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g)].map(
        (m) => ({
          text: unescape(m[5] as string),
          xMin: Number(m[1]),
          yMin: Number(m[2]),
          xMax: Number(m[3]),
          yMax: Number(m[4]),
        }),
      ),
    );
}

/** Each page's text as pdf.js reads it (pdf-parse): a line of text drawn at any angle stays one run. */
export async function pdfjsPageTexts(pdf: Buffer): Promise<string[]> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).pages.map((p) => p.text);
  } finally {
    await parser.destroy();
  }
}
