import "server-only";
import type { Pool as CallbackPool } from "mysql2";
import { RateLimiterMySQL } from "rate-limiter-flexible";
import { isLimiterRefusal } from "@/lib/auth/limiter-refusal";
import { hashToken } from "./tokens";
import { isRefused, signInDelayMs } from "./throttle-policy";

// Failed sign-ins are counted in MariaDB (table rate_limits, created by the migrations), so every
// app instance sees the same counters.
export type ThrottleOptions = {
  pool: CallbackPool;
  dbName: string;
  maxFailsPerAccount: number;
  maxFailsPerIp: number;
  windowSeconds: number;
};

export type ThrottleVerdict = { refused: boolean; delayMs: number; retryAfterMs: number };

export const ACCOUNT_PREFIX = "signin-account";
export const IP_PREFIX = "signin-ip";

/** Accounts are keyed by a hash of the address, so the table holds no e-mail addresses. */
export const accountKey = (email: string) => hashToken(email.trim().toLowerCase());

export function createSignInThrottle(opts: ThrottleOptions) {
  const limiter = (keyPrefix: string, points: number) =>
    new RateLimiterMySQL({
      storeClient: opts.pool,
      storeType: "pool",
      dbName: opts.dbName,
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix,
      points,
      duration: opts.windowSeconds,
    });
  const byAccount = limiter(ACCOUNT_PREFIX, opts.maxFailsPerAccount);
  const byIp = limiter(IP_PREFIX, opts.maxFailsPerIp);

  async function fail(rl: RateLimiterMySQL, key: string, max: number) {
    try {
      const res = await rl.consume(key);
      // Reaching the limit starts a full window of refusal from this failure on.
      if (isRefused(res.consumedPoints, max)) await rl.block(key, opts.windowSeconds);
    } catch (err) {
      if (!isLimiterRefusal(err)) throw err;
    }
  }

  return {
    options: opts,
    async check({ email, ip }: { email: string; ip: string }): Promise<ThrottleVerdict> {
      const [a, i] = await Promise.all([byAccount.get(accountKey(email)), byIp.get(ip)]);
      const aFails = a?.consumedPoints ?? 0;
      const iFails = i?.consumedPoints ?? 0;
      const refusedA = isRefused(aFails, opts.maxFailsPerAccount);
      const refusedI = isRefused(iFails, opts.maxFailsPerIp);
      return {
        refused: refusedA || refusedI,
        delayMs: Math.max(signInDelayMs(aFails, opts.maxFailsPerAccount), signInDelayMs(iFails, opts.maxFailsPerIp)),
        retryAfterMs: Math.max(refusedA ? (a?.msBeforeNext ?? 0) : 0, refusedI ? (i?.msBeforeNext ?? 0) : 0),
      };
    },
    async recordFailure({ email, ip }: { email: string; ip: string }): Promise<void> {
      await Promise.all([
        fail(byAccount, accountKey(email), opts.maxFailsPerAccount),
        fail(byIp, ip, opts.maxFailsPerIp),
      ]);
    },
    /** A correct password clears the account's counter; the address keeps its count. */
    async recordSuccess({ email }: { email: string }): Promise<void> {
      await byAccount.delete(accountKey(email));
    },
  };
}

export type SignInThrottle = ReturnType<typeof createSignInThrottle>;
