import "server-only";
import { RateLimiterMySQL, RateLimiterRes } from "rate-limiter-flexible";
import { pool } from "@/db";
import { findUserByEmail } from "@/db/queries/members";
import { completePasswordReset, createPasswordReset } from "@/db/queries/password-resets";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send";
import { passwordResetMail } from "@/lib/mail/templates";
import { hashPassword } from "./password";
import { databaseName, signInThrottle } from "./sign-in";
import { accountKey } from "./throttle";
import { newToken, PASSWORD_RESET_TTL_MS } from "./tokens";

const globalForReset = globalThis as unknown as { forkwallResetLimiter?: RateLimiterMySQL };

// At most a few reset e-mails per address per hour, so the form cannot be used to flood an inbox.
function resetMailLimiter(): RateLimiterMySQL {
  globalForReset.forkwallResetLimiter ??= new RateLimiterMySQL({
    storeClient: pool.pool,
    storeType: "pool",
    dbName: databaseName(env.DATABASE_URL),
    tableName: "rate_limits",
    tableCreated: true,
    keyPrefix: "reset-mail",
    points: 5,
    duration: 60 * 60,
  });
  return globalForReset.forkwallResetLimiter;
}

export const resetLink = (token: string) => `${env.APP_URL}/reset-password/${token}`;

/**
 * Sends a reset link when the address has an account; does nothing visible otherwise. Callers
 * answer the same way in both cases (and run this after responding, so timing tells nothing).
 */
export async function requestPasswordReset({ email }: { email: string }): Promise<"sent" | "no-account" | "limited"> {
  const user = await findUserByEmail({ email });
  if (!user) return "no-account";
  try {
    await resetMailLimiter().consume(accountKey(email));
  } catch (err) {
    if (err instanceof RateLimiterRes) return "limited";
    throw err;
  }
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + PASSWORD_RESET_TTL_MS);
  await createPasswordReset({ userId: user.id, tokenHash: hash, expiresAt });
  await sendMail({ to: user.email, ...passwordResetMail({ link: resetLink(token), expiresAt }) });
  return "sent";
}

/** Sets the new password through a valid link and lifts any sign-in pause on the account. */
export async function resetPassword({ tokenHash, password }: { tokenHash: string; password: string }) {
  const user = await completePasswordReset({ tokenHash, passwordHash: await hashPassword(password) });
  await signInThrottle().recordSuccess({ email: user.email });
  return user;
}
