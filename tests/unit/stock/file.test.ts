import { describe, expect, it } from "vitest";
import { decodeImportFile } from "@/lib/stock/file";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { refusal } from "../../support/refusal";

const bytes = (s: string) => new TextEncoder().encode(s);

const refused = (input: Uint8Array) => refusal(decodeImportFile(input));

describe("decodeImportFile", () => {
  it("returns UTF-8 text without its byte-order mark", async () => {
    expect(await decodeImportFile(new Uint8Array([0xef, 0xbb, 0xbf, ...bytes("family,é")]))).toBe("family,é");
    expect(await decodeImportFile(bytes("a;b\r\n"))).toBe("a;b\r\n");
  });

  it("accepts exactly 1 MB and refuses one byte more with 413", async () => {
    const atLimit = new Uint8Array(MAX_IMPORT_BYTES).fill(0x61);
    expect((await decodeImportFile(atLimit)).length).toBe(MAX_IMPORT_BYTES);
    const over = await refused(new Uint8Array(MAX_IMPORT_BYTES + 1).fill(0x61));
    expect(over.status).toBe(413);
    expect(over.message).toContain("the limit is 1 MB");
  });

  it("refuses an empty file", async () => {
    expect((await refused(new Uint8Array())).message).toBe("The file is empty.");
  });

  it("refuses NUL bytes and control characters as binary, naming the line", async () => {
    const nul = await refused(bytes("family,compliance\nA,nc\0\n"));
    expect(nul.status).toBe(400);
    expect(nul.message).toContain("a NUL byte on line 2");
    expect((await refused(bytes("abc\x01"))).message).toContain("a control character on line 1");
  });

  it("refuses invalid UTF-8 (a Windows-1252 é), naming the line", async () => {
    const err = await refused(new Uint8Array([...bytes("family\nCaf"), 0xe9, ...bytes(",nc\n")]));
    expect(err.status).toBe(400);
    expect(err.message).toContain("not valid UTF-8 text (first bad character on line 2)");
  });

  it("refuses UTF-16 with a clear hint", async () => {
    const err = await refused(new Uint8Array([0xff, 0xfe, 0x61, 0x00]));
    expect(err.message).toContain("UTF-16");
  });

  it("recognises a spreadsheet workbook (ZIP) and a PDF", async () => {
    const zip = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00, ...new Array(60).fill(0)]);
    expect((await refused(zip)).message).toMatch(/not CSV text \(it looks like (ZIP|XLSX)/);
    const pdf = bytes("%PDF-1.7\n%\u00e2\u00e3\n1 0 obj\n");
    expect((await refused(pdf)).message).toContain("looks like PDF");
  });
});
