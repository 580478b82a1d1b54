import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import {
  bearerToken,
  hashMachineToken,
  looksLikeMachineToken,
  newMachineToken,
  tokenDisableReason,
} from "@/lib/auth/machine-tokens";
import { checkWriteRequest } from "@/lib/http/origin";

describe("machine tokens", () => {
  it("are fwt_ and 43 url-safe characters (256 random bits), a 10-character hint, and stored as SHA-256", () => {
    const seen = new Set<string>();
    for (let i = 0; i < 200; i++) {
      const { token, hash, hint } = newMachineToken();
      expect(token).toMatch(/^fwt_[A-Za-z0-9_-]{43}$/);
      expect(Buffer.from(token.slice(4), "base64url")).toHaveLength(32);
      expect(hash).toBe(createHash("sha256").update(token).digest("hex"));
      expect(hashMachineToken(token)).toBe(hash);
      expect(hint).toBe(token.slice(0, 10));
      seen.add(token);
    }
    expect(seen.size).toBe(200);
  });

  it("reads the credential of a Bearer header, and nothing from other schemes", () => {
    expect(bearerToken("Bearer fwt_abc")).toBe("fwt_abc");
    expect(bearerToken("bearer   fwt_abc  ")).toBe("fwt_abc");
    expect(bearerToken("Basic dXNlcjpwYXNz")).toBeNull();
    expect(bearerToken("Bearer")).toBeNull();
    expect(bearerToken(null)).toBeNull();
    // A header with two words is still a Bearer request (refused as an invalid token), never a session.
    expect(bearerToken("Bearer a b")).toBe("a b");
    expect(looksLikeMachineToken("a b")).toBe(false);
  });

  it("treats as Bearer exactly what the write check exempts from the Origin check", () => {
    for (const header of ["Bearer x", "bearer\tx", "Bearer a b", "Bearer", "Basic x", "Bearerx y", ""]) {
      const exempt = checkWriteRequest(
        { method: "POST", headers: new Headers({ origin: "http://evil.example", authorization: header }) },
        "http://localhost:3000",
      ).ok;
      expect(bearerToken(header) !== null, header).toBe(exempt);
    }
  });

  it("looks up only well-formed tokens", () => {
    expect(looksLikeMachineToken(newMachineToken().token)).toBe(true);
    expect(looksLikeMachineToken(`fwt_${"A".repeat(42)}`)).toBe(false);
    expect(looksLikeMachineToken(`xyz_${"A".repeat(43)}`)).toBe(false);
  });
});

describe("tokenDisableReason", () => {
  it("disables a creator's tokens when they go or stop managing, not otherwise", () => {
    expect(tokenDisableReason("Ann", "removed")).toBe("Its creator, Ann, was removed from the lab.");
    expect(tokenDisableReason("Ann", "left")).toBe("Its creator, Ann, left the lab.");
    expect(tokenDisableReason("Ann", { role: "manager" })).toBeNull();
    for (const role of ["lead", "educator", "operator"] as const)
      expect(tokenDisableReason("Ann", { role }), role).toMatch(/^Its creator, Ann, is no longer a manager \(now /);
  });
});
