import "server-only";
import { RateLimiterMemory, RateLimiterMySQL, type RateLimiterAbstract } from "rate-limiter-flexible";
import { isLimiterRefusal } from "@/lib/auth/limiter-refusal";
import { pool } from "@/db";
import { env } from "@/lib/env";
import { type AppError, isAppError, rateLimited } from "@/lib/errors";
import { databaseName } from "./sign-in";

// Public endpoints (the solve API, the check page and its API, short-code lookups) answer
// anyone; each client address gets PUBLIC_RATE_LIMIT_PER_MINUTE requests a minute per kind.
// Short codes (40 bits, worth guessing) and the solve API are counted in MariaDB's rate_limits
// (the sign-in throttle's table) so every app instance shares them. The check page (a 144-bit
// token nobody can guess) is counted in each instance's memory: a scan costs no database write,
// and with N instances an address gets at most N times the limit.
export type PublicKind = "solve" | "check" | "short-code";

/** 429 with Retry-After for one client address. */
export const publicRateLimited = (seconds: number) =>
  rateLimited(
    `Too many requests from your address. Try again in ${seconds} second${seconds === 1 ? "" : "s"}.`,
    seconds,
  );

/** True for any of the app's 429s, whichever loaded copy of the module made it. */
export const isRateLimited = (err: unknown): err is AppError => isAppError(err) && err.code === "rate_limited";

export function createPublicLimiter(opts: { points: number; durationSeconds: number; keyPrefix?: string }) {
  const limiters = new Map<PublicKind, RateLimiterAbstract>();
  const limiter = (kind: PublicKind) => {
    let l = limiters.get(kind);
    if (!l) {
      const common = {
        keyPrefix: `${opts.keyPrefix ?? "public"}-${kind}`,
        points: opts.points,
        duration: opts.durationSeconds,
      };
      l =
        kind === "check"
          ? new RateLimiterMemory(common)
          : new RateLimiterMySQL({
              ...common,
              storeClient: pool.pool,
              storeType: "pool",
              dbName: databaseName(env.DATABASE_URL),
              tableName: "rate_limits",
              tableCreated: true,
            });
      limiters.set(kind, l);
    }
    return l;
  };
  return {
    /** Counts one request; throws a rate_limited AppError (429, Retry-After) past the limit. */
    async take(kind: PublicKind, ip: string): Promise<void> {
      try {
        await limiter(kind).consume(ip);
      } catch (err) {
        if (isLimiterRefusal(err)) throw publicRateLimited(Math.max(1, Math.ceil(err.msBeforeNext / 1000)));
        throw err;
      }
    },
  };
}

const g = globalThis as unknown as { forkwallPublicLimiter?: ReturnType<typeof createPublicLimiter> };

/** The app's limiter (one per process; counters live in the database). */
export function limitPublic(kind: PublicKind, ip: string): Promise<void> {
  g.forkwallPublicLimiter ??= createPublicLimiter({ points: env.PUBLIC_RATE_LIMIT_PER_MINUTE, durationSeconds: 60 });
  return g.forkwallPublicLimiter.take(kind, ip);
}
