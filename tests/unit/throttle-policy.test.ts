import { describe, expect, it } from "vitest";
import { clientAddress, isRefused, signInDelayMs, throttledMessage } from "@/lib/auth/throttle-policy";

describe("sign-in throttle policy", () => {
  it("answers at once at first, then slower with each failure, capped at 2 s", () => {
    const delays = [0, 1, 2, 3, 4, 5, 6].map((f) => signInDelayMs(f, 5));
    expect(delays).toEqual([0, 0, 250, 500, 1000, 2000, 2000]);
    for (let i = 1; i < delays.length; i++) expect(delays[i]!).toBeGreaterThanOrEqual(delays[i - 1]!);
    expect(signInDelayMs(14, 30)).toBe(0);
    expect(signInDelayMs(15, 30)).toBe(250);
  });

  it("refuses from the limit on", () => {
    expect(isRefused(4, 5)).toBe(false);
    expect(isRefused(5, 5)).toBe(true);
  });

  it("takes the address the nearest proxy saw (right-most X-Forwarded-For)", () => {
    expect(clientAddress(new Headers({ "x-forwarded-for": "198.51.100.1, 203.0.113.7" }))).toBe("203.0.113.7");
    expect(clientAddress(new Headers({ "x-forwarded-for": "::ffff:127.0.0.1" }))).toBe("127.0.0.1");
    expect(clientAddress(new Headers({ "x-real-ip": "192.0.2.4" }))).toBe("192.0.2.4");
    expect(clientAddress(new Headers())).toBe("unknown");
  });

  it("tells the person what happened and how long to wait", () => {
    expect(throttledMessage(900)).toMatch(/^Too many failed attempts\. .*15 minutes/);
    expect(throttledMessage(30)).toContain("1 minute;");
  });
});
