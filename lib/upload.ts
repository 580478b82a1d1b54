// Reads one file from a multipart request without ever holding more than the limit in memory.
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { ENVELOPE_BYTES, ONE_MB, tooLargeMessage } from "./upload-limits";

export type UploadedFile = { name: string; bytes: Uint8Array };

export { ONE_MB };

export function payloadTooLarge(bytes: number, maxBytes: number, hint: string): AppError {
  return new AppError("payload_too_large", tooLargeMessage(bytes, maxBytes, hint));
}

export async function readUploadedFile(
  req: Request,
  {
    field = "file",
    maxBytes = ONE_MB,
    tooLargeHint = "Send a smaller file.",
  }: { field?: string; maxBytes?: number; tooLargeHint?: string } = {},
): Promise<UploadedFile> {
  const tooLarge = (bytes: number) => payloadTooLarge(bytes, maxBytes, tooLargeHint);
  const type = req.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("invalid_input", `Send the file as multipart/form-data in the field "${field}".`, [
      { path: [field], message: "No file was sent." },
    ]);
  }
  const cap = maxBytes + ENVELOPE_BYTES;
  const declared = Number(req.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > cap) throw tooLarge(declared);
  if (!req.body)
    throw new AppError("invalid_input", `Choose a file to send in the field "${field}".`, [
      { path: [field], message: "No file was sent." },
    ]);

  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = req.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > cap) {
      await reader.cancel();
      throw tooLarge(total);
    }
    chunks.push(value);
  }
  let form: FormData;
  try {
    form = await new Response(Buffer.concat(chunks), { headers: { "content-type": type } }).formData();
  } catch {
    throw new AppError("invalid_input", "The upload could not be read as multipart/form-data.");
  }
  const file = form.get(field);
  if (!file || typeof file === "string") {
    throw new AppError("invalid_input", `Choose a file to send in the field "${field}".`, [
      { path: [field], message: "No file was sent." },
    ]);
  }
  if (file.size > maxBytes) throw tooLarge(file.size);
  return { name: file.name.slice(0, 200), bytes: new Uint8Array(await file.arrayBuffer()) };
}

/**
 * An uploaded file as operation input: the file itself, or a reader that the operation calls only
 * after it has checked the caller's role (so a refused request never uploads anything).
 */
export type FileInput = UploadedFile | (() => Promise<UploadedFile>);

const isUploaded = (v: unknown): v is UploadedFile =>
  v !== null && typeof v === "object" && "bytes" in v && (v as UploadedFile).bytes instanceof Uint8Array;

export const fileInput = (what: string) => z.custom<FileInput>((v) => typeof v === "function" || isUploaded(v), what);

export async function readFileInput(file: FileInput): Promise<UploadedFile> {
  return typeof file === "function" ? file() : file;
}
