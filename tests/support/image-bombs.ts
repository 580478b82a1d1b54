// PNGs built chunk by chunk, for tests and the logo benchmark: honest small images and
// "bombs" whose header or compressed data promise far more pixels than the file's size suggests.
import { createDeflate, crc32 } from "node:zlib";

function chunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, "latin1");
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])));
  return Buffer.concat([head, data, crc]);
}

/** Deflates `n` zero bytes without holding them all in memory. */
export async function deflateZeros(n: number): Promise<Buffer> {
  const z = createDeflate({ level: 9 });
  const out: Buffer[] = [];
  z.on("data", (c: Buffer) => out.push(c));
  const done = new Promise((r) => z.on("end", r));
  const block = Buffer.alloc(1024 * 1024);
  for (let left = n; left > 0; left -= block.length) {
    const part = left >= block.length ? block : block.subarray(0, left);
    if (!z.write(part)) await new Promise((r) => z.once("drain", r));
  }
  z.end();
  await done;
  return Buffer.concat(out);
}

export type PngSpec = { width: number; height: number; bitDepth?: number; colorType?: number; interlaced?: boolean };

const CHANNELS: Record<number, number> = { 0: 1, 2: 3, 3: 1, 4: 2, 6: 4 };

/** Bytes of filtered scanlines the header promises (the number a decoder will inflate to). */
export function declaredBytes(s: PngSpec): number {
  const bpp = CHANNELS[s.colorType ?? 6]! * (s.bitDepth ?? 8);
  const row = (w: number) => 1 + Math.ceil((w * bpp) / 8);
  if (!s.interlaced) return s.height * row(s.width);
  const passes = [
    [0, 0, 8, 8],
    [4, 0, 8, 8],
    [0, 4, 4, 8],
    [2, 0, 4, 4],
    [0, 2, 2, 4],
    [1, 0, 2, 2],
    [0, 1, 1, 2],
  ];
  let sum = 0;
  for (const [x0, y0, dx, dy] of passes) {
    const w = Math.ceil((s.width - x0!) / dx!);
    const h = Math.ceil((s.height - y0!) / dy!);
    if (w > 0 && h > 0) sum += h * row(w);
  }
  return sum;
}

/** A PNG whose IDAT inflates to `inflate` zero bytes (default: exactly what the header declares). */
export async function craftPng(s: PngSpec, inflate = declaredBytes(s)): Promise<Buffer> {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(s.width, 0);
  ihdr.writeUInt32BE(s.height, 4);
  ihdr[8] = s.bitDepth ?? 8;
  ihdr[9] = s.colorType ?? 6;
  ihdr[12] = s.interlaced ? 1 : 0;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", await deflateZeros(inflate)),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}
