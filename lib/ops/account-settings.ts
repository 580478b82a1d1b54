import "server-only";
import * as q from "@/db/queries/accounts";
import { listAccountEvents } from "@/db/queries/audit";
import { disableTokensOf } from "@/db/queries/tokens";
import { findUserByEmail, listLabsForUser } from "@/db/queries/members";
import { mayMail } from "@/lib/auth/account-limits";
import { tokenDisableReason } from "@/lib/auth/machine-tokens";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { describeAction } from "@/lib/audit/describe";
import { AppError, rateLimited } from "@/lib/errors";
import { sendMail } from "@/lib/mail/send";
import { emailTakenMail } from "@/lib/mail/templates/account";
import { changeEmailSchema, changeNameSchema, changePasswordSchema } from "@/lib/validation/account";
import { signedIn } from "./access";
import type { Caller } from "./caller";
import { labOperation, parseInput, traced } from "./operation";
import { mailNewLink } from "./sign-up";
import { accountWrite, labWrite } from "./write";

// The account page: a person's own name, address, password and labs. Each needs a confirmed
// address (an unconfirmed account can only ask for a new link).

export async function verifiedAccount(caller: Caller) {
  const user = signedIn(caller);
  const account = await q.findAccount({ userId: user.id });
  if (!account) throw new AppError("unauthenticated", "Sign in to continue.");
  if (!account.emailVerifiedAt)
    throw new AppError("forbidden", "Confirm your e-mail address first: open the link we sent you.");
  return account;
}

const wrongPassword = () =>
  new AppError("invalid_input", "currentPassword: That is not your current password.", [
    { path: ["currentPassword"], message: "That is not your current password." },
  ]);

/** Recent account events shown on the account page (they appear in no lab's log). */
export const ACCOUNT_ACTIVITY_ROWS = 20;

export async function readAccount(caller: Caller) {
  const account = await verifiedAccount(caller);
  const [labs, pendingEmail, events] = await Promise.all([
    listLabsForUser({ userId: account.id }),
    q.findPendingEmail({ userId: account.id }),
    listAccountEvents({ userId: account.id, limit: ACCOUNT_ACTIVITY_ROWS }),
  ]);
  const activity = events.map((e) => {
    const ip = (e.detail as { ip?: unknown } | null)?.ip;
    return { id: e.id, at: e.createdAt, what: describeAction(e.action), from: typeof ip === "string" ? ip : null };
  });
  return { id: account.id, name: account.name, email: account.email, pendingEmail, labs, activity };
}

export async function changeName(caller: Caller, raw: unknown) {
  const account = await verifiedAccount(caller);
  const { name } = parseInput(changeNameSchema, raw);
  return traced("account.name.change", { userId: account.id }, () =>
    accountWrite((tx) => q.updateAccountName(tx, { userId: account.id, name })),
  );
}

/**
 * A new address takes effect only when a link sent to it is used. The answer is the same whether
 * or not another account has that address (that account's owner gets a note instead).
 */
export async function requestEmailChange(caller: Caller, raw: unknown) {
  const account = await verifiedAccount(caller);
  const { email, currentPassword } = parseInput(changeEmailSchema, raw);
  return traced("account.email.change", { userId: account.id }, async () => {
    if (!(await verifyPassword(currentPassword, account.passwordHash))) throw wrongPassword();
    if (email === account.email)
      throw new AppError("invalid_input", "email: That is already your address.", [
        { path: ["email"], message: "That is already your address." },
      ]);
    const allowed = await mayMail(account.email);
    if (!allowed.ok)
      throw rateLimited(
        `Several links went out in the last hour. Try again in ${allowed.retryMinutes} minutes.`,
        allowed.retryMinutes * 60,
      );
    if (await findUserByEmail({ email })) await sendMail({ to: email, ...emailTakenMail() });
    else await mailNewLink(account, email, "change");
    return { pendingEmail: email };
  });
}

/**
 * Needs the current password; every session ends, so the person signs in again with the new one,
 * and every pending e-mail change link ends.
 */
export async function changePassword(caller: Caller, raw: unknown) {
  const account = await verifiedAccount(caller);
  const { currentPassword, password } = parseInput(changePasswordSchema, raw);
  return traced("account.password.change", { userId: account.id }, async () => {
    if (!(await verifyPassword(currentPassword, account.passwordHash))) throw wrongPassword();
    const passwordHash = await hashPassword(password);
    await accountWrite(async (tx) => {
      await q.updateAccountPassword(tx, { userId: account.id, passwordHash });
      // Whoever held the old password may have asked to move the account: those links end here.
      await q.revokeEmailChangeLinks(tx, { userId: account.id });
    });
    return { signedOut: true };
  });
}

/** The caller leaves a lab (their machine tokens there are disabled); refused (409) for its last manager. */
export const leaveLab = labOperation({
  name: "member.leave",
  capability: "lab:read",
  scope: "lab",
  run: ({ labId, member }) =>
    labWrite(labId, async (tx) => {
      const left = await q.leaveLab(tx, { labId, userId: member.user.id });
      const reason = tokenDisableReason(member.user.name, "left")!;
      await disableTokensOf(tx, { labId, userId: member.user.id, reason, actorUserId: member.user.id });
      return left;
    }),
});
