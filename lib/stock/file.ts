// Turns an uploaded stock file into text, refusing what is not a small UTF-8 text file.
import { fileTypeFromBuffer } from "file-type";
import { AppError } from "@/lib/errors";
import { payloadTooLarge } from "@/lib/upload";
import { MAX_IMPORT_BYTES } from "./limits";

const SAVE_AS = 'Save it from your spreadsheet as "CSV UTF-8" and try again.';

export const CSV_TOO_LARGE_HINT = "Split it into smaller files.";

export function tooLarge(bytes: number): AppError {
  return payloadTooLarge(bytes, MAX_IMPORT_BYTES, CSV_TOO_LARGE_HINT);
}

const lineAt = (text: string, index: number) => text.slice(0, index).split("\n").length;

/** Checks size and content and returns the text without a byte-order mark; throws a 4xx AppError. */
export async function decodeImportFile(bytes: Uint8Array): Promise<string> {
  if (bytes.length === 0) throw new AppError("invalid_input", "The file is empty.");
  if (bytes.length > MAX_IMPORT_BYTES) throw tooLarge(bytes.length);
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    throw new AppError("invalid_input", `The file is UTF-16 text; Forkwall reads UTF-8. ${SAVE_AS}`);
  }
  const type = await fileTypeFromBuffer(bytes);
  if (type)
    throw new AppError(
      "invalid_input",
      `The file is not CSV text (it looks like ${type.ext.toUpperCase()}, ${type.mime}). ${SAVE_AS}`,
    );
  const control = bytes.findIndex((b) => b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d);
  if (control >= 0) {
    const line = lineAt(new TextDecoder().decode(bytes.subarray(0, control)), control);
    throw new AppError(
      "invalid_input",
      `The file is not text: it contains binary data (${bytes[control] === 0 ? "a NUL byte" : "a control character"} on line ${line}). ${SAVE_AS}`,
    );
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    const lossy = new TextDecoder("utf-8").decode(bytes);
    throw new AppError(
      "invalid_input",
      `The file is not valid UTF-8 text (first bad character on line ${lineAt(lossy, lossy.indexOf("\uFFFD"))}). ${SAVE_AS}`,
    );
  }
}
