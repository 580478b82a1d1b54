import "server-only";
import {
  completeEmailVerification,
  revokeEmailChangeLinks,
  createEmailVerification,
  createUnverifiedAccount,
  findAccount,
  findEmailVerification,
} from "@/db/queries/accounts";
import { findUserByEmail } from "@/db/queries/members";
import { consumeSignUp, mayMail } from "@/lib/auth/account-limits";
import { hashPassword } from "@/lib/auth/password";
import { EMAIL_VERIFICATION_TTL_MS, hashToken, looksLikeToken, newToken } from "@/lib/auth/tokens";
import { env } from "@/lib/env";
import { AppError, isAppError, rateLimited } from "@/lib/errors";
import { log } from "@/lib/log";
import { sendMail } from "@/lib/mail/send";
import {
  alreadyHaveAccountMail,
  emailChangedMail,
  verifyNewEmailMail,
  verifySignUpMail,
} from "@/lib/mail/templates/account";
import { signUpSchema } from "@/lib/validation/account";
import { signedIn } from "./access";
import type { Caller } from "./caller";
import { parseInput, traced } from "./operation";
import { accountWrite, duplicateKey } from "./write";

export const verifyLink = (token: string) => `${env.APP_URL}/verify-email/${token}`;

export const INVITE_ONLY_MESSAGE =
  "This Forkwall is invitation-only: accounts are created by accepting an invitation from a lab's manager.";

/** Refuses sign-up when the installation is invitation-only (SIGNUP=invite-only). */
export function assertSignUpOpen(): void {
  if (env.SIGNUP !== "open") throw new AppError("forbidden", INVITE_ONLY_MESSAGE);
}

/**
 * What a sign-up accepts before anything is stored: open sign-up, valid fields (400 naming each),
 * and the per-address limit (429). Everything it answers is the same for every e-mail address.
 */
export async function admitSignUp(raw: unknown, { ip }: { ip: string }) {
  assertSignUpOpen();
  const input = parseInput(signUpSchema, raw);
  await consumeSignUp(ip);
  return input;
}

/** Stores a new link for `email` (hash only) and mails it. */
export async function mailNewLink(user: { id: number; name: string }, email: string, kind: "sign-up" | "change") {
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + EMAIL_VERIFICATION_TTL_MS);
  await accountWrite((tx) => createEmailVerification(tx, { userId: user.id, email, tokenHash: hash, expiresAt }));
  const content =
    kind === "sign-up"
      ? verifySignUpMail({ name: user.name, link: verifyLink(token), expiresAt })
      : verifyNewEmailMail({ name: user.name, link: verifyLink(token), expiresAt });
  await sendMail({ to: email, ...content });
}

async function mailAlreadyHaveAccount(email: string) {
  if (!(await mayMail(email)).ok) return;
  await sendMail({
    to: email,
    ...alreadyHaveAccountMail({ signInLink: `${env.APP_URL}/sign-in`, resetLink: `${env.APP_URL}/forgot-password` }),
  });
}

/**
 * The work of an admitted sign-up, run after the answer has gone (so its timing says nothing):
 * a new address gets an unverified account and a confirmation link; an address that already
 * has an account gets a "you already have an account" e-mail instead, and nothing changes.
 */
export async function completeSignUp(input: { name: string; email: string; password: string }, { ip }: { ip: string }) {
  return traced("account.sign_up", {}, async () => {
    const passwordHash = await hashPassword(input.password);
    if (await findUserByEmail({ email: input.email })) {
      await mailAlreadyHaveAccount(input.email);
      return "existing" as const;
    }
    let created: { id: number };
    try {
      created = await accountWrite((tx) =>
        createUnverifiedAccount(tx, { email: input.email, name: input.name, passwordHash, ip }),
      );
    } catch (err) {
      // Two sign-ups for one new address at once: the second is an existing account.
      if (isAppError(err) && err.code === "conflict") {
        await mailAlreadyHaveAccount(input.email);
        return "existing" as const;
      }
      throw err;
    }
    if ((await mayMail(input.email)).ok)
      await mailNewLink({ id: created.id, name: input.name }, input.email, "sign-up");
    return "created" as const;
  });
}

/** Both halves in one call (tests and scripts); the edges answer between them. */
export async function signUp(raw: unknown, { ip }: { ip: string }) {
  const input = await admitSignUp(raw, { ip });
  return completeSignUp(input, { ip });
}

/** Whether the signed-in caller still has to confirm their address (false for anonymous). */
export async function needsVerification(caller: Caller): Promise<boolean> {
  if (caller.kind !== "user") return false;
  const account = await findAccount({ userId: caller.user.id });
  return Boolean(account && !account.emailVerifiedAt);
}

/** A fresh confirmation link for the signed-in, unverified caller (older links stop working). */
export async function resendVerification(caller: Caller) {
  const user = signedIn(caller);
  return traced("account.verification.resend", { userId: user.id }, async () => {
    const account = await findAccount({ userId: user.id });
    if (!account) throw new AppError("unauthenticated", "Sign in to continue.");
    if (account.emailVerifiedAt)
      throw new AppError("conflict", "Your address is already confirmed; there is nothing to resend.");
    const allowed = await mayMail(account.email);
    if (!allowed.ok)
      throw rateLimited(
        `Several links went out in the last hour. Use the newest one, or ask again in ${allowed.retryMinutes} minutes.`,
        allowed.retryMinutes * 60,
      );
    await mailNewLink(account, account.email, "sign-up");
    return { email: account.email };
  });
}

/** Uses a confirmation link: the sign-up's address is verified, or an e-mail change takes effect. */
export async function verifyEmail({ token }: { token: string }) {
  return traced("account.verification.complete", {}, async () => {
    if (!looksLikeToken(token))
      throw new AppError("not_found", "This confirmation link is not valid. Check that you copied the whole link.");
    let done;
    try {
      done = await accountWrite(async (tx) => {
        const verified = await completeEmailVerification(tx, { tokenHash: hashToken(token) });
        // A change took effect: no other pending change link may move the account again.
        if (verified.changedFrom) await revokeEmailChangeLinks(tx, { userId: verified.userId });
        return verified;
      });
    } catch (err) {
      if (duplicateKey(err) !== null)
        throw new AppError("conflict", "Another account already uses that address, so yours was not changed.");
      throw err;
    }
    if (done.changedFrom)
      await sendMail({ to: done.changedFrom, ...emailChangedMail({ newEmail: done.email }) }).catch((err: unknown) =>
        log.warn({ err }, "e-mail change notice failed"),
      );
    return done;
  });
}

/** What a confirmation link is, for its page; null when it names nothing. */
export async function readVerificationLink({ token }: { token: string }) {
  return looksLikeToken(token) ? findEmailVerification({ tokenHash: hashToken(token) }) : null;
}
