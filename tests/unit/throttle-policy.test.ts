import { describe, expect, it } from "vitest";
import { isRefused, signInDelayMs, throttledMessage } from "@/lib/auth/throttle-policy";

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

  it("tells the person what happened and how long to wait", () => {
    expect(throttledMessage(900)).toMatch(/^Too many failed attempts\. .*15 minutes/);
    expect(throttledMessage(30)).toContain("1 minute;");
  });
});
