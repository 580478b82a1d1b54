import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import PDFDocument from "pdfkit";
import { PNG } from "pngjs";
import { describe, expect, it } from "vitest";
import { checkLogo, jpegSize, LOGO_MAX_BYTES, LOGO_MAX_INFLATED_BYTES, readPngHeader } from "@/lib/logo";
import { craftPng, declaredBytes } from "../support/image-bombs";
import { refusal } from "../support/refusal";

function png(width: number, height: number): Buffer {
  const img = new PNG({ width, height });
  img.data.fill(200);
  return PNG.sync.write(img);
}

/** A real JPEG made by an independent encoder: poppler's pdftoppm rasterising a tiny PDF. */
async function jpeg(): Promise<Buffer> {
  const dir = mkdtempSync(path.join(tmpdir(), "forkwall-logo-"));
  try {
    const doc = new PDFDocument({ size: [72, 36] });
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    const done = new Promise((r) => doc.on("end", r));
    doc.rect(6, 6, 30, 20).fill("#164f5d");
    doc.end();
    await done;
    writeFileSync(path.join(dir, "in.pdf"), Buffer.concat(chunks));
    execFileSync("pdftoppm", ["-jpeg", "-r", "72", "-singlefile", path.join(dir, "in.pdf"), path.join(dir, "out")]);
    return readFileSync(path.join(dir, "out.jpg"));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const refused = (bytes: Uint8Array) => refusal(checkLogo(bytes));

describe("checkLogo", () => {
  it("accepts a PNG, reading its type and size from the bytes", async () => {
    const bytes = png(40, 20);
    expect(await checkLogo(bytes)).toEqual({
      mime: "image/png",
      width: 40,
      height: 20,
      sha256: createHash("sha256").update(bytes).digest("hex"),
    });
  });

  it("accepts a JPEG made by another encoder (pdftoppm), with its frame size", async () => {
    const bytes = await jpeg();
    const checked = await checkLogo(bytes);
    expect(checked.mime).toBe("image/jpeg");
    expect(jpegSize(bytes)).toEqual({ width: 72, height: 36 });
  });

  it("refuses a text file named .png (the name is never trusted)", async () => {
    const err = await refused(new TextEncoder().encode("this is not a PNG at all\n".repeat(20)));
    expect(err.status).toBe(400);
    expect(err.message).toMatch(/PNG or JPEG.*not an image/);
    expect(err.issues?.[0]?.path).toEqual(["file"]);
  });

  it("refuses a PNG signature followed by garbage, and other image types", async () => {
    const fake = Buffer.concat([png(4, 4).subarray(0, 33), Buffer.from("garbage".repeat(30))]);
    expect((await refused(fake)).message).toMatch(/damaged/);
    const gif = Buffer.concat([Buffer.from("GIF89a"), Buffer.alloc(64, 1)]);
    expect((await refused(gif)).message).toMatch(/is GIF/);
  });

  it("refuses more than 1 MB with 413", async () => {
    const big = Buffer.concat([png(4, 4), Buffer.alloc(1024 * 1024)]);
    expect((await refused(big)).status).toBe(413);
  });

  it("refuses an image larger than 4000 pixels a side", async () => {
    expect((await refused(png(4100, 1))).message).toMatch(/4000 pixels/);
  });
});

describe("checkLogo against image bombs (the header is read before anything is inflated)", () => {
  it("refuses a small file declaring 8000 × 8000 pixels, from the header alone", async () => {
    // Only the first rows are really there: a decoder would still allocate for the whole picture.
    const bomb = await craftPng({ width: 8000, height: 8000 }, 64 * 1024);
    expect(bomb.length).toBeLessThan(10 * 1024);
    const err = await refused(bomb);
    expect(err.status).toBe(400);
    expect(err.message).toMatch(/8000 × 8000 pixels; keep it within 4000 pixels a side/);
  });

  it("refuses a 4000 × 4000 16-bit RGBA picture (128 MB of pixels) by its area", async () => {
    const bomb = await craftPng({ width: 4000, height: 4000, bitDepth: 16 });
    expect(bomb.length).toBeLessThan(LOGO_MAX_BYTES);
    expect((await refused(bomb)).message).toMatch(/16\.0 megapixels\); keep it within 4 megapixels/);
  });

  it("refuses a header whose pixels inflate past the cap although the area is allowed", async () => {
    const err = await refused(await craftPng({ width: 2000, height: 1900, bitDepth: 16, interlaced: true }, 1024));
    expect(err.message).toMatch(/MB uncompressed.*keep it within 24 MB/);
    expect(declaredBytes({ width: 2000, height: 1900, bitDepth: 16, interlaced: true })).toBeGreaterThan(
      LOGO_MAX_INFLATED_BYTES,
    );
  });

  it("refuses an interlaced PNG whose data inflates far past what its header declares", async () => {
    // 1000 × 1000 declared (about 4 MB of pixels), 96 MB in the stream: inflation stops at the declared size.
    const bomb = await craftPng({ width: 1000, height: 1000, interlaced: true }, 96 * 1024 * 1024);
    expect(bomb.length).toBeLessThan(LOGO_MAX_BYTES);
    expect((await refused(bomb)).message).toMatch(/damaged/);
  });

  it("refuses pixel data shorter than the header declares, and a bad chunk checksum", async () => {
    const short = await craftPng({ width: 100, height: 100 }, 1000);
    expect((await refused(short)).message).toMatch(/damaged/);
    const good = png(10, 10);
    const flipped = Buffer.from(good);
    flipped[good.length - 20] = flipped[good.length - 20]! ^ 0xff;
    expect((await refused(flipped)).message).toMatch(/damaged/);
  });

  it("accepts honest interlaced and deep-colour PNGs within the limits, reading their header", async () => {
    const interlaced = await craftPng({ width: 333, height: 77, interlaced: true });
    expect(await checkLogo(interlaced)).toMatchObject({ mime: "image/png", width: 333, height: 77 });
    const deep = await craftPng({ width: 1000, height: 1000, bitDepth: 16 });
    expect(await checkLogo(deep)).toMatchObject({ width: 1000, height: 1000 });
    const header = readPngHeader(deep)!;
    expect(header).toMatchObject({ bitDepth: 16, colorType: 6, interlaced: false, inflatedBytes: 1000 * 8001 });
  });

  it("refuses a JPEG whose frame declares more than 4 megapixels", async () => {
    const bytes = Buffer.from(await jpeg());
    // Rewrite the start-of-frame size to 3000 × 3000 (9 MP) without decoding anything.
    for (let i = 2; i < bytes.length - 9; i++) {
      if (bytes[i] === 0xff && bytes[i + 1] === 0xc0) {
        bytes.writeUInt16BE(3000, i + 5);
        bytes.writeUInt16BE(3000, i + 7);
        break;
      }
    }
    expect(jpegSize(bytes)).toEqual({ width: 3000, height: 3000 });
    expect((await refused(bytes)).message).toMatch(/9\.0 megapixels/);
  });
});
