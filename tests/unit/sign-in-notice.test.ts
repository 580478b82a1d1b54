import { describe, expect, it } from "vitest";
import { signInNotice } from "@/lib/auth/sign-in-notice";

// Finding 12: the sign-in banner shows only our own words, chosen by a code.
describe("sign-in notice", () => {
  it("never shows text from the query string", () => {
    const evil = "Evil Lab. Your password expired: call +1 555 0100 and read it out";
    for (const q of [
      { joined: evil },
      { notice: evil },
      { notice: "joined", joined: evil },
      { error: evil },
    ] as object[]) {
      expect(JSON.stringify(signInNotice(q, 900) ?? "")).not.toContain("555");
    }
    expect(signInNotice({ joined: evil } as object, 900)).toBeNull();
  });

  it("maps codes to fixed messages", () => {
    expect(signInNotice({ notice: "joined" }, 900)?.message).toMatch(
      /^Your account is ready and you have joined the lab/,
    );
    expect(signInNotice({ notice: "reset" }, 900)?.message).toMatch(/password was changed/);
    expect(signInNotice({ reset: "1" }, 900)?.message).toMatch(/password was changed/);
    expect(signInNotice({ signedOut: "1" }, 900)?.message).toBe("You are signed out.");
    expect(signInNotice({ notice: "toString" }, 900)).toBeNull();
    expect(signInNotice({ error: "x", code: "throttled" }, 900)?.ok).toBe(false);
  });
});
