import "server-only";
import { RateLimiterMySQL } from "rate-limiter-flexible";
import { isLimiterRefusal } from "@/lib/auth/limiter-refusal";
import { pool } from "@/db";
import { env } from "@/lib/env";
import { rateLimited } from "@/lib/errors";
import { databaseName } from "./sign-in";
import { accountKey } from "./throttle";

// Sign-up and its e-mails are counted in MariaDB's rate_limits (like the sign-in throttle), so
// every app instance shares the counts.
export const SIGN_UPS_PER_ADDRESS_PER_HOUR = 10;
export const ACCOUNT_MAILS_PER_HOUR = 5;

const globalForLimits = globalThis as unknown as { forkwallAccountLimits?: Map<string, RateLimiterMySQL> };

function limiter(keyPrefix: string, points: number): RateLimiterMySQL {
  const all = (globalForLimits.forkwallAccountLimits ??= new Map());
  let rl = all.get(keyPrefix);
  if (!rl) {
    rl = new RateLimiterMySQL({
      storeClient: pool.pool,
      storeType: "pool",
      dbName: databaseName(env.DATABASE_URL),
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix,
      points,
      duration: 60 * 60,
    });
    all.set(keyPrefix, rl);
  }
  return rl;
}

const minutes = (ms: number) => Math.max(1, Math.ceil(ms / 60_000));

/** Sign-up attempts from one client address: past the limit, 429 (the same for every e-mail). */
export async function consumeSignUp(ip: string): Promise<void> {
  try {
    await limiter("signup-ip", SIGN_UPS_PER_ADDRESS_PER_HOUR).consume(ip);
  } catch (err) {
    if (!isLimiterRefusal(err)) throw err;
    throw rateLimited(
      `Too many sign-ups from this network. Try again in ${minutes(err.msBeforeNext)} minutes.`,
      err.msBeforeNext / 1000,
    );
  }
}

/**
 * Account e-mails (confirmation links, "you already have an account") per address: true when
 * one may go out now. Callers that must not reveal whether an address has an account stay
 * silent when it is false; a signed-in person asking for a new link is told to wait.
 */
export async function mayMail(email: string): Promise<{ ok: true } | { ok: false; retryMinutes: number }> {
  try {
    await limiter("account-mail", ACCOUNT_MAILS_PER_HOUR).consume(accountKey(email));
    return { ok: true };
  } catch (err) {
    if (!isLimiterRefusal(err)) throw err;
    return { ok: false, retryMinutes: minutes(err.msBeforeNext) };
  }
}
