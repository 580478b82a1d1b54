import { describe, expect, it } from "vitest";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";
import { readUploadedFile } from "@/lib/upload";
import { refusal } from "../../support/refusal";

const multipart = (file: Blob, name = "file") => {
  const form = new FormData();
  form.append(name, file, "stock.csv");
  return new Request("http://localhost/x", { method: "POST", body: form });
};

const refused = (req: Request) => refusal(readUploadedFile(req));

describe("readUploadedFile", () => {
  it("returns the file's name and bytes", async () => {
    const file = await readUploadedFile(multipart(new Blob(["family,compliance\n"])));
    expect(file.name).toBe("stock.csv");
    expect(new TextDecoder().decode(file.bytes)).toBe("family,compliance\n");
  });

  it("refuses a body that is not multipart, and a form without the file", async () => {
    const json = new Request("http://localhost/x", {
      method: "POST",
      body: "{}",
      headers: { "content-type": "application/json" },
    });
    expect((await refused(json)).message).toBe('Send the file as multipart/form-data in the field "file".');
    expect((await refused(multipart(new Blob(["x"]), "other"))).message).toBe(
      'Choose a file to send in the field "file".',
    );
  });

  it("refuses a file over 1 MB with 413", async () => {
    const err = await refused(multipart(new Blob([new Uint8Array(MAX_IMPORT_BYTES + 1)])));
    expect(err.status).toBe(413);
  });

  it("stops reading a huge body early, whatever Content-Length says", async () => {
    let pulled = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += 1;
        controller.enqueue(new Uint8Array(256 * 1024));
        if (pulled > 400) controller.close();
      },
    });
    const req = new Request("http://localhost/x", {
      method: "POST",
      body: stream,
      headers: { "content-type": "multipart/form-data; boundary=x" },
      duplex: "half",
    } as RequestInit);
    expect((await refused(req)).status).toBe(413);
    expect(pulled).toBeLessThan(10);
  });
});
