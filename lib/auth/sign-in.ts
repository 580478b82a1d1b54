import "server-only";
import { pool } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { findUserByEmail } from "@/db/queries/members";
import { env } from "@/lib/env";
import { verifyPassword } from "./password";
import { createSignInThrottle, type SignInThrottle } from "./throttle";

// Compared against when no account has the address, so both answers take as long (a hash of
// random bytes nobody knows).
const NO_ACCOUNT_HASH = "$2b$11$hwF.o.9jeAtfJtvdWWkAn.4v1s9pd4xaqYc/ijJYIjpnjDUw20ttS";

const globalForThrottle = globalThis as unknown as { forkwallSignInThrottle?: SignInThrottle };

export function databaseName(url: string): string {
  return decodeURIComponent(new URL(url).pathname.replace(/^\//, ""));
}

export function signInThrottle(): SignInThrottle {
  globalForThrottle.forkwallSignInThrottle ??= createSignInThrottle({
    pool: pool.pool,
    dbName: databaseName(env.DATABASE_URL),
    maxFailsPerAccount: env.SIGNIN_MAX_FAILS_PER_ACCOUNT,
    maxFailsPerIp: env.SIGNIN_MAX_FAILS_PER_IP,
    windowSeconds: env.SIGNIN_THROTTLE_SECONDS,
  });
  return globalForThrottle.forkwallSignInThrottle;
}

export type SignInResult =
  | { ok: true; user: { id: number; email: string; name: string; sessionVersion: number } }
  | { ok: false; reason: "invalid" | "throttled"; retryAfterMs?: number };

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Checks a password under the throttle and records the attempt (never the password). */
export async function verifySignIn(input: {
  email: string;
  password: string;
  ip: string;
  throttle?: SignInThrottle;
  /** How the slow-down waits; tests pass one that records instead of sleeping. */
  sleep?: (ms: number) => Promise<void>;
}): Promise<SignInResult> {
  const throttle = input.throttle ?? signInThrottle();
  const email = input.email.trim().toLowerCase();
  const ip = input.ip;
  const verdict = await throttle.check({ email, ip });
  const user = await findUserByEmail({ email });
  const target = user ? { targetType: "user", targetId: user.id } : {};
  if (verdict.refused) {
    await recordAudit({ labId: null, actorUserId: null, action: "signin.refused", ...target, detail: { email, ip } });
    return { ok: false, reason: "throttled", retryAfterMs: verdict.retryAfterMs };
  }
  if (verdict.delayMs > 0) await (input.sleep ?? sleep)(verdict.delayMs);
  const matches = await verifyPassword(input.password, user?.passwordHash ?? NO_ACCOUNT_HASH);
  if (!user || !matches) {
    await throttle.recordFailure({ email, ip });
    await recordAudit({ labId: null, actorUserId: null, action: "signin.failed", ...target, detail: { email, ip } });
    return { ok: false, reason: "invalid" };
  }
  await throttle.recordSuccess({ email });
  await recordAudit({
    labId: null,
    actorUserId: user.id,
    action: "signin.succeeded",
    targetType: "user",
    targetId: user.id,
    detail: { ip },
  });
  return { ok: true, user: { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion } };
}
