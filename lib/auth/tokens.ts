import { createHash, randomBytes } from "node:crypto";

// Links sent by e-mail carry a random token; only its SHA-256 is stored, so a copy of the
// database cannot be turned into working links.
export const INVITATION_TTL_MS = 72 * 60 * 60 * 1000;
export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;
export const EMAIL_VERIFICATION_TTL_MS = 24 * 60 * 60 * 1000;

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashToken(token) };
}

/** Tokens are 43 url-safe characters; anything else is not worth a database lookup. */
export function looksLikeToken(value: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(value);
}
