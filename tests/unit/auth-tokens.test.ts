import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { hashToken, INVITATION_TTL_MS, looksLikeToken, newToken, PASSWORD_RESET_TTL_MS } from "@/lib/auth/tokens";
import { linkState } from "@/lib/link-state";

describe("e-mailed link tokens", () => {
  it("hashes with SHA-256 (known vector) and never returns the token itself", () => {
    expect(hashToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    const { token, hash } = newToken();
    expect(hash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(hash).not.toContain(token);
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("makes 256-bit url-safe tokens that do not repeat", () => {
    const tokens = new Set(Array.from({ length: 500 }, () => newToken().token));
    expect(tokens.size).toBe(500);
    for (const t of tokens) expect(looksLikeToken(t)).toBe(true);
    expect(looksLikeToken("short")).toBe(false);
    expect(looksLikeToken("a".repeat(42) + "/")).toBe(false);
  });

  it("lasts 72 hours for invitations and one hour for password resets", () => {
    expect(INVITATION_TTL_MS).toBe(72 * 3600 * 1000);
    expect(PASSWORD_RESET_TTL_MS).toBe(3600 * 1000);
  });

  it("says whether a link still works: used and revoked win over expiry, expiry is exclusive", () => {
    const now = new Date("2026-01-01T12:00:00Z");
    const later = new Date("2026-01-01T12:00:01Z");
    expect(linkState({ expiresAt: later }, now)).toBe("valid");
    expect(linkState({ expiresAt: now }, now)).toBe("expired");
    expect(linkState({ expiresAt: later, usedAt: now }, now)).toBe("used");
    expect(linkState({ expiresAt: later, revokedAt: now }, now)).toBe("revoked");
  });
});
