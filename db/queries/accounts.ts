import "server-only";
import { and, count, eq, isNull, ne } from "drizzle-orm";
import { linkState } from "@/lib/link-state";
import { AppError } from "@/lib/errors";
import { db } from "../index";
import { emailVerifications, labs, memberships, users } from "../schema";
import { recordAudit, type Tx } from "./audit";
import { bumpSessionVersion } from "./sessions";

/** A self sign-up: the account exists but can do nothing until its address is confirmed. */
export async function createUnverifiedAccount(
  tx: Tx,
  input: { email: string; name: string; passwordHash: string; ip: string },
) {
  const [row] = await tx
    .insert(users)
    .values({ email: input.email, name: input.name, passwordHash: input.passwordHash, emailVerifiedAt: null })
    .$returningId();
  await recordAudit({
    tx,
    labId: null,
    actorUserId: row!.id,
    action: "account.created",
    targetType: "user",
    targetId: row!.id,
    detail: { email: input.email, ip: input.ip },
  });
  return { id: row!.id };
}

/** A new link for `email`; the person's older open links for the same address stop working. */
export async function createEmailVerification(
  tx: Tx,
  input: { userId: number; email: string; tokenHash: string; expiresAt: Date },
) {
  await tx
    .update(emailVerifications)
    .set({ usedAt: new Date() })
    .where(and(eq(emailVerifications.userId, input.userId), isNull(emailVerifications.usedAt)));
  await tx.insert(emailVerifications).values(input);
}

/**
 * Ends every open e-mail change link of the account (links to an address other than its current
 * one); sign-up links are left alone. Returns how many were ended.
 */
export async function revokeEmailChangeLinks(tx: Tx, { userId }: { userId: number }): Promise<number> {
  const [user] = await tx.select({ email: users.email }).from(users).where(eq(users.id, userId));
  if (!user) return 0;
  const [res] = await tx
    .update(emailVerifications)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(emailVerifications.userId, userId),
        isNull(emailVerifications.usedAt),
        isNull(emailVerifications.revokedAt),
        ne(emailVerifications.email, user.email),
      ),
    );
  return res.affectedRows;
}

export async function findAccount({ userId }: { userId: number }) {
  const [row] = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      passwordHash: users.passwordHash,
      emailVerifiedAt: users.emailVerifiedAt,
    })
    .from(users)
    .where(eq(users.id, userId));
  return row ?? null;
}

/** The address a pending e-mail change waits to confirm, if any. */
export async function findPendingEmail({ userId }: { userId: number }) {
  const [row] = await db
    .select({ email: emailVerifications.email, expiresAt: emailVerifications.expiresAt })
    .from(emailVerifications)
    .innerJoin(users, eq(users.id, emailVerifications.userId))
    .where(
      and(
        eq(emailVerifications.userId, userId),
        isNull(emailVerifications.usedAt),
        isNull(emailVerifications.revokedAt),
        ne(emailVerifications.email, users.email),
      ),
    );
  return row && row.expiresAt.getTime() > Date.now() ? row : null;
}

export async function findEmailVerification({ tokenHash }: { tokenHash: string }) {
  const [row] = await db
    .select({
      email: emailVerifications.email,
      expiresAt: emailVerifications.expiresAt,
      usedAt: emailVerifications.usedAt,
      revokedAt: emailVerifications.revokedAt,
      currentEmail: users.email,
    })
    .from(emailVerifications)
    .innerJoin(users, eq(users.id, emailVerifications.userId))
    .where(eq(emailVerifications.tokenHash, tokenHash));
  if (!row) return null;
  return {
    ...row,
    kind: row.email === row.currentEmail ? ("sign-up" as const) : ("change" as const),
    state: linkState(row),
  };
}

const LINK_PROBLEM = {
  expired: "This confirmation link has expired. Sign in and ask for a new one.",
  used: "This confirmation link has already been used (or a newer one was sent). Sign in to continue.",
  revoked: "This confirmation link is no longer valid. Sign in and ask for a new one.",
} as const;

/**
 * Single use, under a row lock: a sign-up link marks the account verified; a change link moves
 * the account to the new address (refused, changing nothing, when another account took it since).
 */
export async function completeEmailVerification(tx: Tx, { tokenHash }: { tokenHash: string }) {
  const [link] = await tx
    .select()
    .from(emailVerifications)
    .where(eq(emailVerifications.tokenHash, tokenHash))
    .for("update");
  if (!link)
    throw new AppError("not_found", "This confirmation link is not valid. Check that you copied the whole link.");
  const state = linkState(link);
  if (state !== "valid") throw new AppError("conflict", LINK_PROBLEM[state]);
  const [user] = await tx.select().from(users).where(eq(users.id, link.userId)).for("update");
  if (!user) throw new AppError("not_found", "This confirmation link is not valid.");
  const now = new Date();
  await tx.update(emailVerifications).set({ usedAt: now }).where(eq(emailVerifications.id, link.id));
  if (link.email === user.email) {
    if (!user.emailVerifiedAt) await tx.update(users).set({ emailVerifiedAt: now }).where(eq(users.id, user.id));
    await recordAudit({
      tx,
      labId: null,
      actorUserId: user.id,
      action: "account.email_verified",
      targetType: "user",
      targetId: user.id,
      detail: { email: user.email },
    });
    return { userId: user.id, email: user.email, changedFrom: null as string | null };
  }
  const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, link.email));
  if (taken)
    throw new AppError("conflict", `Another account already uses ${link.email}, so your address was not changed.`);
  await tx.update(users).set({ email: link.email, emailVerifiedAt: now }).where(eq(users.id, user.id));
  await recordAudit({
    tx,
    labId: null,
    actorUserId: user.id,
    action: "account.email_changed",
    targetType: "user",
    targetId: user.id,
    detail: { before: { email: user.email }, after: { email: link.email } },
  });
  return { userId: user.id, email: link.email, changedFrom: user.email };
}

export async function updateAccountName(tx: Tx, { userId, name }: { userId: number; name: string }) {
  const [user] = await tx.select({ name: users.name }).from(users).where(eq(users.id, userId)).for("update");
  if (!user) throw new AppError("not_found", "That account was not found.");
  if (user.name === name) return { changed: false };
  await tx.update(users).set({ name }).where(eq(users.id, userId));
  await recordAudit({
    tx,
    labId: null,
    actorUserId: userId,
    action: "account.name_changed",
    targetType: "user",
    targetId: userId,
    detail: { before: { name: user.name }, after: { name } },
  });
  return { changed: true };
}

/** A new password ends every session of the person (the caller signs in again with it). */
export async function updateAccountPassword(
  tx: Tx,
  { userId, passwordHash }: { userId: number; passwordHash: string },
) {
  await tx.update(users).set({ passwordHash }).where(eq(users.id, userId));
  await bumpSessionVersion({ tx, userId });
  await recordAudit({
    tx,
    labId: null,
    actorUserId: userId,
    action: "account.password_changed",
    targetType: "user",
    targetId: userId,
  });
}

/** The caller leaves a lab; a lab keeps at least one manager. */
export async function leaveLab(tx: Tx, { labId, userId }: { labId: number; userId: number }) {
  const [mine] = await tx
    .select({ id: memberships.id, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.labId, labId), eq(memberships.userId, userId)))
    .for("update");
  if (!mine) throw new AppError("not_found", "Lab was not found.");
  if (mine.role === "manager") {
    const [row] = await tx
      .select({ n: count() })
      .from(memberships)
      .where(and(eq(memberships.labId, labId), eq(memberships.role, "manager")));
    if (Number(row?.n ?? 0) <= 1) {
      const [lab] = await tx.select({ name: labs.name }).from(labs).where(eq(labs.id, labId));
      throw new AppError(
        "conflict",
        `You are the only manager of ${lab?.name ?? "this lab"}, so you cannot leave it. Make another member a manager on its Members page first, then leave.`,
      );
    }
  }
  await tx.delete(memberships).where(and(eq(memberships.labId, labId), eq(memberships.id, mine.id)));
  await recordAudit({
    tx,
    labId,
    actorUserId: userId,
    action: "member.left",
    targetType: "membership",
    targetId: mine.id,
    detail: { before: { role: mine.role }, after: null },
  });
  return { role: mine.role };
}

export async function isEmailVerified({ userId }: { userId: number }): Promise<boolean> {
  const [row] = await db.select({ at: users.emailVerifiedAt }).from(users).where(eq(users.id, userId));
  return Boolean(row?.at);
}
