import { randomInt } from "node:crypto";

/**
 * The short code printed under a poster's QR code, for typing on a phone: 8 symbols of 5 bits
 * (40 random bits) from Douglas Crockford's Base32 alphabet, which leaves out I, L, O and U so
 * that no two symbols look alike (https://www.crockford.com/base32.html). Read case-insensitively;
 * the look-alikes a person may type (I, L for 1; O for 0) are read as the digit, and hyphens and
 * spaces are ignored. Stored without the hyphen; printed in two groups of four, `K7QM-2XHD`.
 */
export const SHORT_CODE_ALPHABET = "0123456789ABCDEFGHJKMNPQRSTVWXYZ";
export const SHORT_CODE_LENGTH = 8;
export const SHORT_CODE_BITS = SHORT_CODE_LENGTH * Math.log2(SHORT_CODE_ALPHABET.length);

export function newShortCode(): string {
  let code = "";
  for (let i = 0; i < SHORT_CODE_LENGTH; i++) code += SHORT_CODE_ALPHABET[randomInt(SHORT_CODE_ALPHABET.length)];
  return code;
}

/** `K7QM2XHD` -> `K7QM-2XHD`. */
export function formatShortCode(code: string): string {
  return `${code.slice(0, 4)}-${code.slice(4)}`;
}

/** What a person typed -> the stored code, or null when it cannot be one (checked before any query). */
export function parseShortCode(input: string): string | null {
  if (typeof input !== "string" || input.length > 32) return null;
  const code = input.toUpperCase().replace(/[\s-]/g, "").replace(/[IL]/g, "1").replace(/O/g, "0");
  if (code.length !== SHORT_CODE_LENGTH) return null;
  for (const ch of code) if (!SHORT_CODE_ALPHABET.includes(ch)) return null;
  return code;
}
