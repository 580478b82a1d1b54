import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { db } from "../index";
import { users } from "../schema";
import { recordAudit, type Tx } from "./audit";

/**
 * The person behind a session cookie, only while the cookie's session version is the account's
 * current one (a reset, sign-out or removal from a lab has not happened since it was issued).
 */
export async function findSessionUser({ id, sessionVersion }: { id: number; sessionVersion: number }) {
  const [row] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(and(eq(users.id, id), eq(users.sessionVersion, sessionVersion)));
  return row ?? null;
}

export async function findSessionVersion({ userId }: { userId: number }): Promise<number | null> {
  const [row] = await db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, userId));
  return row?.v ?? null;
}

/** Ends every session of a person (all browsers), inside the caller's transaction when given. */
export async function bumpSessionVersion({ tx, userId }: { tx?: Tx; userId: number }): Promise<void> {
  await (tx ?? db)
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId));
}

/** Sign-out: every cookie this person holds stops working, on this browser and any other. */
export async function signOutEverywhere({ userId }: { userId: number }): Promise<void> {
  await db.transaction(async (tx) => {
    await bumpSessionVersion({ tx, userId });
    await recordAudit({
      tx,
      labId: null,
      actorUserId: userId,
      action: "signout",
      targetType: "user",
      targetId: userId,
    });
  });
}
