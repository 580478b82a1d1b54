import "server-only";
import { RateLimiterMySQL } from "rate-limiter-flexible";
import { isLimiterRefusal } from "@/lib/auth/limiter-refusal";
import { pool } from "@/db";
import { revokeEmailChangeLinks } from "@/db/queries/accounts";
import type { Tx } from "@/db/queries/audit";
import {
  acceptInvitation as acceptInvitationRow,
  findAccountForInvitation,
  findInvitationByTokenHash,
  lockInvitationByTokenHash,
} from "@/db/queries/invitations";
import { findUserByEmail, listLabsForUser } from "@/db/queries/members";
import { completePasswordReset, createPasswordReset, findPasswordReset } from "@/db/queries/password-resets";
import { acceptanceRefusal } from "@/lib/auth/invitation-acceptance";
import { hashPassword } from "@/lib/auth/password";
import { databaseName, signInThrottle } from "@/lib/auth/sign-in";
import { accountKey } from "@/lib/auth/throttle";
import { hashToken, looksLikeToken, newToken, PASSWORD_RESET_TTL_MS } from "@/lib/auth/tokens";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send";
import { passwordResetMail } from "@/lib/mail/templates";
import { signedIn } from "./access";
import type { Caller } from "./caller";
import { traced } from "./operation";
import { accountWrite } from "./write";

// Account operations: they belong to a person, not to one lab.

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
  return traced("account.reset.request", {}, async () => {
    const user = await findUserByEmail({ email });
    if (!user) return "no-account";
    try {
      await resetMailLimiter().consume(accountKey(email));
    } catch (err) {
      if (isLimiterRefusal(err)) return "limited";
      throw err;
    }
    const { token, hash } = newToken();
    const expiresAt = new Date(Date.now() + PASSWORD_RESET_TTL_MS);
    await accountWrite((tx) => createPasswordReset(tx, { userId: user.id, tokenHash: hash, expiresAt }));
    await sendMail({ to: user.email, ...passwordResetMail({ link: resetLink(token), expiresAt }) });
    return "sent";
  });
}

/** Sets the new password through a valid link and lifts any sign-in pause on the account. */
export async function resetPassword({ token, password }: { token: string; password: string }) {
  return traced("account.reset.complete", {}, async () => {
    const passwordHash = await hashPassword(password);
    const user = await accountWrite(async (tx) => {
      const reset = await completePasswordReset(tx, { tokenHash: hashToken(token), passwordHash });
      // Whoever held the old password may have asked to move the account: those links end here.
      await revokeEmailChangeLinks(tx, { userId: reset.id });
      return reset;
    });
    await signInThrottle().recordSuccess({ email: user.email });
    return user;
  });
}

type Joiner = { newAccount: { name: string; passwordHash: string } } | { userId: number };

/** Accepts an invitation inside `tx`: the row locked, the decision (pure) made, then the writes. */
export async function acceptInvitationIn(tx: Tx, input: { tokenHash: string } & Joiner) {
  const inv = await lockInvitationByTokenHash(tx, { tokenHash: input.tokenHash });
  const joiner =
    "newAccount" in input
      ? {
          kind: "new-account" as const,
          addressTaken: inv ? (await findAccountForInvitation(tx, { email: inv.email })) !== null : false,
        }
      : { kind: "member" as const, account: await findAccountForInvitation(tx, { userId: input.userId }) };
  const refusal = acceptanceRefusal({ invitation: inv, joiner });
  if (refusal) throw refusal;
  return acceptInvitationRow(tx, { ...input, inv: inv! });
}

/** The link is the key: anyone holding a valid invitation link may create the invited account. */
export async function acceptInvitationAsNewAccount({
  token,
  name,
  password,
}: {
  token: string;
  name: string;
  password: string;
}) {
  const passwordHash = await hashPassword(password);
  return traced("invitation.accept", {}, () =>
    accountWrite((tx) => acceptInvitationIn(tx, { tokenHash: hashToken(token), newAccount: { name, passwordHash } })),
  );
}

/** A signed-in person accepts an invitation addressed to their own e-mail. */
export async function acceptInvitationAsMember(caller: Caller, { token }: { token: string }) {
  const user = signedIn(caller);
  return traced("invitation.accept", { userId: user.id }, () =>
    accountWrite((tx) => acceptInvitationIn(tx, { tokenHash: hashToken(token), userId: user.id })),
  );
}

/** The labs the caller belongs to, with their role in each (the lab switcher, the dashboard). */
export async function listMyLabs(caller: Caller) {
  if (caller.kind !== "user") return [];
  return listLabsForUser({ userId: caller.user.id });
}

/** What a password-reset link is (valid, used, expired), for its page; null when it names nothing. */
export async function readResetLink({ token }: { token: string }) {
  return looksLikeToken(token) ? findPasswordReset({ tokenHash: hashToken(token) }) : null;
}

/** What an invitation link is, for its page; null when it names nothing. */
export async function readInvitationLink({ token }: { token: string }) {
  return looksLikeToken(token) ? findInvitationByTokenHash({ tokenHash: hashToken(token) }) : null;
}
