import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import PDFDocument from "pdfkit";
import { PNG } from "pngjs";
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { checkLogo, jpegSize } from "@/lib/logo";

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

async function refusal(bytes: Uint8Array): Promise<AppError> {
  const err = await checkLogo(bytes).then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

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
    const err = await refusal(new TextEncoder().encode("this is not a PNG at all\n".repeat(20)));
    expect(err.status).toBe(400);
    expect(err.message).toMatch(/PNG or JPEG.*not an image/);
    expect(err.issues?.[0]?.path).toEqual(["file"]);
  });

  it("refuses a PNG signature followed by garbage, and other image types", async () => {
    const fake = Buffer.concat([png(4, 4).subarray(0, 33), Buffer.from("garbage".repeat(30))]);
    expect((await refusal(fake)).message).toMatch(/damaged/);
    const gif = Buffer.concat([Buffer.from("GIF89a"), Buffer.alloc(64, 1)]);
    expect((await refusal(gif)).message).toMatch(/is GIF/);
  });

  it("refuses more than 1 MB with 413", async () => {
    const big = Buffer.concat([png(4, 4), Buffer.alloc(1024 * 1024)]);
    expect((await refusal(big)).status).toBe(413);
  });

  it("refuses an image larger than 4000 pixels a side", async () => {
    expect((await refusal(png(4100, 1))).message).toMatch(/4000 pixels/);
  });
});
