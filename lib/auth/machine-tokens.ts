import { createHash, randomBytes } from "node:crypto";
import { can, ROLE_LABELS, type Role } from "@/lib/permissions";

// Machine tokens let a lab's inventory system call the stock API without a person. A token is
// "fwt_" and 43 url-safe characters (32 random bytes, 256 bits); only its SHA-256 is stored, with
// its first characters as a hint so a manager can tell tokens apart. The prefix makes a leaked
// token recognisable to secret scanners and people.
export const TOKEN_PREFIX = "fwt_";
const HINT_LENGTH = TOKEN_PREFIX.length + 6;

export function hashMachineToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export function newMachineToken(): { token: string; hash: string; hint: string } {
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString("base64url")}`;
  return { token, hash: hashMachineToken(token), hint: token.slice(0, HINT_LENGTH) };
}

/**
 * The credential of an `Authorization: Bearer ...` header (the same test the write check of
 * lib/http/origin.ts exempts), or null when the request carries no Bearer header.
 */
export function bearerToken(header: string | null): string | null {
  if (!/^Bearer\s+\S+/i.test(header ?? "")) return null;
  return header!.replace(/^Bearer\s+/i, "").trim();
}

/** Only a well-formed token is worth a database lookup. */
export function looksLikeMachineToken(value: string): boolean {
  return /^fwt_[A-Za-z0-9_-]{43}$/.test(value);
}

/**
 * Why a person's tokens in a lab stop working after a change to their membership (removed, left,
 * or a new role), or null when they may still manage tokens and theirs keep working.
 */
export function tokenDisableReason(person: string, change: "removed" | "left" | { role: Role }): string | null {
  if (change === "removed") return `Its creator, ${person}, was removed from the lab.`;
  if (change === "left") return `Its creator, ${person}, left the lab.`;
  if (can(change.role, "tokens:manage")) return null;
  return `Its creator, ${person}, is no longer a manager (now ${ROLE_LABELS[change.role].toLowerCase()}).`;
}
