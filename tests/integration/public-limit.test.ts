// Reliability: public endpoints are rate-limited per client address in MariaDB; past the
// limit they answer 429 with Retry-After, and other addresses are unaffected.
import { afterAll, describe, expect, it } from "vitest";
import { GET as solve } from "@/app/api/v1/solve/route";
import { pool } from "@/db";
import { createPublicLimiter } from "@/lib/auth/public-limit";
import { type AppError, isAppError } from "@/lib/errors";
import { env } from "@/lib/env";
import { PEER_HEADER } from "@/lib/http/client-address";

afterAll(() => pool.end());

const from = (ip: string) =>
  solve(new Request("http://localhost/api/v1/solve?law=finet&mb=3.5&sb=3", { headers: { [PEER_HEADER]: ip } }), {
    params: Promise.resolve({}),
  });
const ip = () => `198.51.100.${Math.floor(Math.random() * 250) + 1}`;

describe("public rate limit", () => {
  it("counts per address and refuses past the limit with the time to wait", async () => {
    const limiter = createPublicLimiter({ points: 3, durationSeconds: 30, keyPrefix: `it-${Date.now()}` });
    const a = ip();
    for (let i = 0; i < 3; i++) await limiter.take("solve", a);
    const err = await limiter.take("solve", a).catch((e: unknown) => e);
    expect(isAppError(err)).toBe(true);
    expect((err as AppError).status).toBe(429);
    expect((err as AppError).retryAfterSeconds).toBeGreaterThan(0);
    expect((err as AppError).retryAfterSeconds).toBeLessThanOrEqual(30);
    await expect(limiter.take("solve", `${a}0`)).resolves.toBeUndefined();
    await expect(limiter.take("check", a)).resolves.toBeUndefined();
  });

  it("the solve API answers 429 with Retry-After past PUBLIC_RATE_LIMIT_PER_MINUTE, from the socket's address", async () => {
    const a = ip();
    const statuses: number[] = [];
    for (let i = 0; i < env.PUBLIC_RATE_LIMIT_PER_MINUTE; i++) statuses.push((await from(a)).status);
    expect(new Set(statuses)).toEqual(new Set([200]));
    const refused = await from(a);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await refused.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
    // A spoofed X-Forwarded-For does not buy a fresh allowance.
    const spoofed = await solve(
      new Request("http://localhost/api/v1/solve?law=finet&mb=3.5&sb=3", {
        headers: { [PEER_HEADER]: a, "x-forwarded-for": "203.0.113.99" },
      }),
      { params: Promise.resolve({}) },
    );
    expect(spoofed.status).toBe(429);
    expect((await from(ip())).status).toBe(200);
  });
});
