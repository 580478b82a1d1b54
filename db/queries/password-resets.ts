import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { linkState } from "@/lib/link-state";
import { AppError } from "@/lib/errors";
import { db } from "../index";
import { passwordResets, users } from "../schema";
import { recordAudit, type Tx } from "./audit";
import { bumpSessionVersion } from "./sessions";

export async function createPasswordReset(
  tx: Tx,
  {
    userId,
    tokenHash,
    expiresAt,
  }: {
    userId: number;
    tokenHash: string;
    expiresAt: Date;
  },
) {
  const [row] = await tx.insert(passwordResets).values({ userId, tokenHash, expiresAt }).$returningId();
  await recordAudit({
    tx,
    labId: null,
    actorUserId: null,
    action: "password_reset.requested",
    targetType: "user",
    targetId: userId,
    detail: { expiresAt: expiresAt.toISOString() },
  });
  return { id: row!.id };
}

export async function findPasswordReset({ tokenHash }: { tokenHash: string }) {
  const [row] = await db
    .select({
      id: passwordResets.id,
      expiresAt: passwordResets.expiresAt,
      usedAt: passwordResets.usedAt,
      email: users.email,
    })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, tokenHash));
  return row ? { ...row, state: linkState(row) } : null;
}

const PROBLEM = {
  expired: "This reset link has expired. Ask for a new one.",
  used: "This reset link has already been used. Ask for a new one if you still need it.",
  revoked: "This reset link is no longer valid. Ask for a new one.",
} as const;

/** Single use: locks the token row, sets the password, and retires every other open link. */
export async function completePasswordReset(
  tx: Tx,
  { tokenHash, passwordHash }: { tokenHash: string; passwordHash: string },
) {
  const [row] = await tx.select().from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash)).for("update");
  if (!row)
    throw new AppError(
      "not_found",
      "This reset link is not valid. Check that you copied the whole link, or ask for a new one.",
    );
  const state = linkState(row);
  if (state !== "valid") throw new AppError("conflict", PROBLEM[state]);
  const now = new Date();
  await tx.update(users).set({ passwordHash }).where(eq(users.id, row.userId));
  await bumpSessionVersion({ tx, userId: row.userId });
  await tx
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.userId, row.userId), isNull(passwordResets.usedAt)));
  await recordAudit({
    tx,
    labId: null,
    actorUserId: row.userId,
    action: "password_reset.completed",
    targetType: "user",
    targetId: row.userId,
  });
  const [user] = await tx.select({ id: users.id, email: users.email }).from(users).where(eq(users.id, row.userId));
  return user!;
}
