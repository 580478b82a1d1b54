// Server actions carry the files the UI uploads, so their request limit must fit the largest file
// limit plus its multipart envelope, and the words the UI shows must follow the constants.
import { describe, expect, it } from "vitest";
// @ts-expect-error -- next.config.mjs is plain JavaScript without type declarations
import nextConfig from "../../next.config.mjs";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { ENVELOPE_BYTES, LOGO_MAX_BYTES, megabytes, ONE_MB, tooLargeMessage } from "@/lib/upload-limits";

const limit = () => {
  const value = (nextConfig as { experimental?: { serverActions?: { bodySizeLimit?: unknown } } }).experimental
    ?.serverActions?.bodySizeLimit;
  if (typeof value !== "number") throw new Error("serverActions.bodySizeLimit must be a number of bytes");
  return value;
};

describe("upload limits", () => {
  it("lets a server action receive the largest allowed file with its form fields", async () => {
    const largest = Math.max(MAX_IMPORT_BYTES, LOGO_MAX_BYTES);
    expect(limit()).toBeGreaterThanOrEqual(largest + ENVELOPE_BYTES);
    const form = new FormData();
    form.set("slug", "a-lab-slug-of-some-length");
    form.set("revision", "2000000000");
    form.set("file", new File([new Uint8Array(largest)], `${"n".repeat(200)}.csv`, { type: "text/csv" }));
    const bytes = (await new Response(form).arrayBuffer()).byteLength;
    expect(bytes).toBeGreaterThan(largest);
    expect(bytes).toBeLessThanOrEqual(limit());
  });

  it("stays just above that: no more than twice the largest file", () => {
    expect(limit()).toBeLessThan(2 * Math.max(MAX_IMPORT_BYTES, LOGO_MAX_BYTES));
  });

  it("says sizes in megabytes the way the forms and errors show them", () => {
    expect(megabytes(ONE_MB)).toBe("1");
    expect(megabytes(1.5 * ONE_MB)).toBe("1.50");
    expect(tooLargeMessage(ONE_MB + 1, ONE_MB, "Split it.")).toBe(
      "The file is 1.00 MB; the limit is 1 MB (1,048,576 bytes). Split it.",
    );
  });
});
