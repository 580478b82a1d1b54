import { describe, expect, it, vi } from "vitest";

// Next can load lib/errors.ts more than once (one copy per bundle); a limiter kept in globalThis
// then throws an AppError of one copy into the error mapping of another.
describe("the app's own errors are recognised whichever loaded copy made them", () => {
  it("a 429 from another copy of lib/errors answers 429 with Retry-After, not 500", async () => {
    const first = await import("@/lib/errors");
    const err = first.rateLimited("Too many requests from your address. Try again in 7 seconds.", 7);
    vi.resetModules();
    const second = await import("@/lib/errors");
    const { errorResponse } = await import("@/lib/http/respond");
    expect(second.AppError).not.toBe(first.AppError);
    expect(err instanceof second.AppError).toBe(false);
    expect(second.isAppError(err)).toBe(true);
    const res = errorResponse(err);
    expect(res.status).toBe(429);
    expect(res.headers.get("retry-after")).toBe("7");
  });

  it("a plain Error or a look-alike object is not an AppError", async () => {
    const { isAppError } = await import("@/lib/errors");
    expect(isAppError(new Error("x"))).toBe(false);
    expect(isAppError({ code: "rate_limited", status: 429, message: "x" })).toBe(false);
    expect(isAppError(null)).toBe(false);
  });

  it("a limiter refusal is recognised by shape, not by class", async () => {
    const { isLimiterRefusal } = await import("@/lib/auth/limiter-refusal");
    expect(isLimiterRefusal({ msBeforeNext: 1200, remainingPoints: 0, consumedPoints: 3 })).toBe(true);
    expect(isLimiterRefusal(new Error("ECONNREFUSED"))).toBe(false);
    expect(isLimiterRefusal({ msBeforeNext: "1" })).toBe(false);
  });
});
