// A lab logo for posters: PNG or JPEG only, at most 1 MB, its type read from the bytes
// themselves (never the file name or the browser's word), and its structure checked so a
// broken image cannot break a poster render.
//
// Image bombs: a small file can declare a huge picture (a PNG's pixels are deflate-compressed,
// about 1000:1 for a flat colour). So the size is read from the header first and capped in
// pixels and in inflated bytes before anything is inflated, and the one inflate that remains
// (to prove the PNG's pixel data is whole) runs on libuv's thread pool with an output cap, never
// on the request thread. JPEGs are not decoded here (PDFs embed them as they are).
import { createHash } from "node:crypto";
import { promisify } from "node:util";
import { crc32, inflate } from "node:zlib";
import { fileTypeFromBuffer } from "file-type";
import { AppError } from "@/lib/errors";
import { LOGO_MAX_BYTES, megabytes, ONE_MB } from "@/lib/upload-limits";

export { LOGO_MAX_BYTES, LOGO_TOO_LARGE_HINT } from "@/lib/upload-limits";
/** Longest side, in pixels. */
export const LOGO_MAX_SIDE = 4000;
/** Whole picture, in pixels (a poster logo is a few centimetres wide; 4 MP is plenty). */
export const LOGO_MAX_AREA = 4_000_000;
/** A PNG's pixel data once inflated (2000 x 2000 RGBA at 8 bits is 16 MB). */
export const LOGO_MAX_INFLATED_BYTES = 24 * ONE_MB;

export type LogoMime = "image/png" | "image/jpeg";
export type CheckedLogo = { mime: LogoMime; sha256: string; width: number; height: number };

const inflateAsync = promisify(inflate);

const refuse = (message: string) => new AppError("invalid_input", message, [{ path: ["file"], message }]);

/** Width and height from a JPEG's start-of-frame segment; null when the markers do not lead to one. */
export function jpegSize(bytes: Uint8Array): { width: number; height: number } | null {
  if (bytes[0] !== 0xff || bytes[1] !== 0xd8) return null;
  let i = 2;
  while (i + 9 < bytes.length) {
    if (bytes[i] !== 0xff) return null;
    const marker = bytes[i + 1]!;
    if (marker === 0xff) {
      i++;
      continue;
    }
    const length = (bytes[i + 2]! << 8) | bytes[i + 3]!;
    if (length < 2) return null;
    // SOF0..SOF15 carry the frame size, except DHT (C4), JPG (C8) and DAC (CC).
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      const height = (bytes[i + 5]! << 8) | bytes[i + 6]!;
      const width = (bytes[i + 7]! << 8) | bytes[i + 8]!;
      return width > 0 && height > 0 ? { width, height } : null;
    }
    i += 2 + length;
  }
  return null;
}

export type PngHeader = {
  width: number;
  height: number;
  bitDepth: number;
  colorType: number;
  interlaced: boolean;
  /** Bytes the pixel data inflates to (filter bytes included), computed from the header. */
  inflatedBytes: number;
  /** The concatenated IDAT chunks, still compressed. */
  idat: Buffer;
};

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
// PNG specification (W3C, 2nd edition), 11.2.2: allowed bit depths per colour type, and channels.
const DEPTHS: Record<number, number[]> = { 0: [1, 2, 4, 8, 16], 2: [8, 16], 3: [1, 2, 4, 8], 4: [8, 16], 6: [8, 16] };
const CHANNELS: Record<number, number> = { 0: 1, 2: 3, 3: 1, 4: 2, 6: 4 };
// Adam7 passes (PNG specification 8.2): x start, y start, x step, y step.
const ADAM7 = [
  [0, 0, 8, 8],
  [4, 0, 8, 8],
  [0, 4, 4, 8],
  [2, 0, 4, 4],
  [0, 2, 2, 4],
  [1, 0, 2, 2],
  [0, 1, 1, 2],
] as const;

/** Rows of each (sub-)image as [rows, bytes per row without the filter byte]. */
function scanlines(
  h: Pick<PngHeader, "width" | "height" | "bitDepth" | "colorType" | "interlaced">,
): [number, number][] {
  const bitsPerPixel = CHANNELS[h.colorType]! * h.bitDepth;
  const rowBytes = (w: number) => Math.ceil((w * bitsPerPixel) / 8);
  if (!h.interlaced) return [[h.height, rowBytes(h.width)]];
  return ADAM7.map(([x0, y0, dx, dy]): [number, number] => {
    const w = Math.ceil((h.width - x0) / dx);
    const rows = Math.ceil((h.height - y0) / dy);
    return w > 0 && rows > 0 ? [rows, rowBytes(w)] : [0, 0];
  }).filter(([rows]) => rows > 0);
}

/**
 * Reads a PNG's chunk structure and header without inflating anything: signature, CRCs, IHDR
 * first with a legal depth/colour type, PLTE for palette images, IDAT present, IEND last.
 * Returns null when the file is not a well-formed PNG.
 */
export function readPngHeader(bytes: Uint8Array): PngHeader | null {
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (buf.length < 8 + 25 + 12 || !buf.subarray(0, 8).equals(PNG_SIGNATURE)) return null;
  let at = 8;
  let header: Omit<PngHeader, "idat" | "inflatedBytes"> | null = null;
  let palette = false;
  let ended = false;
  const idat: Buffer[] = [];
  while (at + 12 <= buf.length) {
    const length = buf.readUInt32BE(at);
    if (length > buf.length - at - 12) return null;
    const type = buf.toString("latin1", at + 4, at + 8);
    const data = buf.subarray(at + 8, at + 8 + length);
    if (crc32(buf.subarray(at + 4, at + 8 + length)) !== buf.readUInt32BE(at + 8 + length)) return null;
    at += 12 + length;
    if (!header) {
      if (type !== "IHDR" || length !== 13) return null;
      const [bitDepth, colorType, compression, filter, interlace] = data.subarray(8, 13);
      const width = data.readUInt32BE(0);
      const height = data.readUInt32BE(4);
      if (width === 0 || height === 0 || width > 2 ** 31 - 1 || height > 2 ** 31 - 1) return null;
      if (!DEPTHS[colorType!]?.includes(bitDepth!) || compression !== 0 || filter !== 0 || interlace! > 1) return null;
      header = { width, height, bitDepth: bitDepth!, colorType: colorType!, interlaced: interlace === 1 };
      continue;
    }
    if (type === "PLTE") palette = true;
    else if (type === "IDAT") idat.push(data);
    else if (type === "IEND") {
      ended = true;
      break;
    }
  }
  if (!header || !ended || idat.length === 0 || (header.colorType === 3 && !palette)) return null;
  const inflatedBytes = scanlines(header).reduce((sum, [rows, row]) => sum + rows * (1 + row), 0);
  return { ...header, inflatedBytes, idat: Buffer.concat(idat) };
}

/** Inflates the pixel data off the request thread, never past what the header promised. */
async function pngPixelsWhole(h: PngHeader): Promise<boolean> {
  let raw: Buffer;
  try {
    raw = await inflateAsync(h.idat, { maxOutputLength: h.inflatedBytes });
  } catch {
    return false; // damaged, or more data than the header declares
  }
  if (raw.length !== h.inflatedBytes) return false;
  // Every scanline starts with a filter type 0..4 (PNG specification 9.2).
  let at = 0;
  for (const [rows, row] of scanlines(h)) {
    for (let r = 0; r < rows; r++, at += 1 + row) if (raw[at]! > 4) return false;
  }
  return true;
}

function checkDimensions(width: number, height: number, inflatedBytes?: number) {
  if (width > LOGO_MAX_SIDE || height > LOGO_MAX_SIDE)
    throw refuse(`The logo is ${width} × ${height} pixels; keep it within ${LOGO_MAX_SIDE} pixels a side.`);
  if (width * height > LOGO_MAX_AREA)
    throw refuse(
      `The logo is ${width} × ${height} pixels (${((width * height) / 1e6).toFixed(1)} megapixels); keep it within ${LOGO_MAX_AREA / 1e6} megapixels.`,
    );
  if (inflatedBytes !== undefined && inflatedBytes > LOGO_MAX_INFLATED_BYTES)
    throw refuse(
      `The logo's pixels take ${(inflatedBytes / ONE_MB).toFixed(0)} MB uncompressed (deep colour or interlacing); keep it within ${LOGO_MAX_INFLATED_BYTES / ONE_MB} MB, e.g. save it as an 8-bit PNG.`,
    );
}

export async function checkLogo(bytes: Uint8Array): Promise<CheckedLogo> {
  if (bytes.length === 0) throw refuse("The file is empty.");
  if (bytes.length > LOGO_MAX_BYTES)
    throw new AppError(
      "payload_too_large",
      `The logo is ${megabytes(bytes.length)} MB; the limit is ${megabytes(LOGO_MAX_BYTES)} MB.`,
    );
  const type = await fileTypeFromBuffer(bytes);
  if (!type || (type.mime !== "image/png" && type.mime !== "image/jpeg")) {
    throw refuse(
      `The logo must be a PNG or JPEG image; this file ${type ? `is ${type.ext.toUpperCase()}` : "is not an image"}, whatever its name says.`,
    );
  }
  const damaged = () => refuse(`The ${type.ext.toUpperCase()} file is damaged and cannot be read as an image.`);
  let size: { width: number; height: number };
  if (type.mime === "image/png") {
    const header = readPngHeader(bytes);
    if (!header) throw damaged();
    checkDimensions(header.width, header.height, header.inflatedBytes);
    if (!(await pngPixelsWhole(header))) throw damaged();
    size = { width: header.width, height: header.height };
  } else {
    const jpeg = jpegSize(bytes);
    if (!jpeg) throw damaged();
    checkDimensions(jpeg.width, jpeg.height);
    size = jpeg;
  }
  return { mime: type.mime, sha256: createHash("sha256").update(bytes).digest("hex"), ...size };
}
