import { describe, expect, it } from "vitest";
import { secureCookies } from "@/lib/auth/cookies";

describe("secure cookies", () => {
  it("are Secure whenever APP_URL is https, and only then", () => {
    expect(secureCookies("https://forkwall.example")).toBe(true);
    expect(secureCookies("https://localhost:3000")).toBe(true);
    expect(secureCookies("http://localhost:3000")).toBe(false);
  });
});
