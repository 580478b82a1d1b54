// A lab logo for posters: PNG or JPEG only, at most 1 MB, its type read from the bytes
// themselves (never the file name or the browser's word), and its structure checked so a
// broken image cannot break a poster render.
import { createHash } from "node:crypto";
import { fileTypeFromBuffer } from "file-type";
import { PNG } from "pngjs";
import { AppError } from "@/lib/errors";
import { LOGO_MAX_BYTES, megabytes } from "@/lib/upload-limits";

export { LOGO_MAX_BYTES, LOGO_TOO_LARGE_HINT } from "@/lib/upload-limits";
export const LOGO_MAX_PIXELS = 4000;
export type LogoMime = "image/png" | "image/jpeg";
export type CheckedLogo = { mime: LogoMime; sha256: string; width: number; height: number };

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
  let size: { width: number; height: number } | null = null;
  if (type.mime === "image/png") {
    try {
      const png = PNG.sync.read(Buffer.from(bytes));
      size = { width: png.width, height: png.height };
    } catch {
      size = null;
    }
  } else size = jpegSize(bytes);
  if (!size) throw refuse(`The ${type.ext.toUpperCase()} file is damaged and cannot be read as an image.`);
  if (size.width > LOGO_MAX_PIXELS || size.height > LOGO_MAX_PIXELS)
    throw refuse(`The logo is ${size.width} × ${size.height} pixels; keep it within ${LOGO_MAX_PIXELS} pixels a side.`);
  return { mime: type.mime, sha256: createHash("sha256").update(bytes).digest("hex"), ...size };
}
