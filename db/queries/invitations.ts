import "server-only";
import { and, asc, eq, isNull, sql } from "drizzle-orm";
import { linkState } from "@/lib/link-state";
import { AppError, notFound } from "@/lib/errors";
import type { Role } from "@/lib/permissions";
import { db } from "../index";
import { invitations, labs, memberships, users } from "../schema";
import { recordAudit, type Tx } from "./audit";

const open = (labId: number) =>
  and(eq(invitations.labId, labId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt));

/** Invitations neither accepted nor revoked, newest first (expired ones stay listed for a resend). */
export async function listOpenInvitations({ labId }: { labId: number }) {
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      lastSentAt: invitations.lastSentAt,
      createdAt: invitations.createdAt,
      invitedByName: users.name,
    })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(open(labId))
    .orderBy(asc(invitations.email));
  const now = new Date();
  return rows.map((r) => ({
    ...r,
    status: r.expiresAt.getTime() <= now.getTime() ? ("expired" as const) : ("pending" as const),
  }));
}

export type OpenInvitation = Awaited<ReturnType<typeof listOpenInvitations>>[number];

export async function createInvitation(
  tx: Tx,
  input: {
    labId: number;
    email: string;
    role: Role;
    /** null: the operator's command-line tool (npm run lab:create), not a person in the app. */
    invitedBy: number | null;
    tokenHash: string;
    expiresAt: Date;
  },
) {
  const [member] = await tx
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.labId, input.labId), eq(users.email, input.email)));
  if (member)
    throw new AppError("conflict", `${input.email} is already a member of this lab.`, [
      { path: ["email"], message: "Already a member of this lab." },
    ]);
  const [pending] = await tx
    .select({ id: invitations.id })
    .from(invitations)
    .where(and(open(input.labId), eq(invitations.email, input.email)));
  if (pending) {
    throw new AppError("conflict", `An invitation to ${input.email} is already open; resend it to send a fresh link.`, [
      { path: ["email"], message: "Already invited: use Resend in the list of open invitations." },
    ]);
  }
  const now = new Date();
  const [row] = await tx
    .insert(invitations)
    .values({
      labId: input.labId,
      email: input.email,
      role: input.role,
      tokenHash: input.tokenHash,
      invitedBy: input.invitedBy,
      expiresAt: input.expiresAt,
      lastSentAt: now,
    })
    .$returningId();
  await recordAudit({
    tx,
    labId: input.labId,
    actorUserId: input.invitedBy,
    action: "invitation.sent",
    targetType: "invitation",
    targetId: row!.id,
    detail: { email: input.email, role: input.role },
  });
  return { id: row!.id, email: input.email, role: input.role, expiresAt: input.expiresAt, lastSentAt: now };
}

async function openInvitationInLab(tx: Tx, labId: number, invitationId: number) {
  const [row] = await tx
    .select()
    .from(invitations)
    .where(and(eq(invitations.labId, labId), eq(invitations.id, invitationId)))
    .for("update");
  if (!row) throw notFound("That invitation");
  if (row.acceptedAt) throw new AppError("conflict", `The invitation to ${row.email} has already been accepted.`);
  if (row.revokedAt) throw new AppError("conflict", `The invitation to ${row.email} was revoked.`);
  return row;
}

/** A fresh link: the old token stops working at once. */
export async function renewInvitation(
  tx: Tx,
  input: {
    labId: number;
    invitationId: number;
    actorUserId: number;
    tokenHash: string;
    expiresAt: Date;
  },
) {
  const row = await openInvitationInLab(tx, input.labId, input.invitationId);
  const now = new Date();
  await tx
    .update(invitations)
    .set({ tokenHash: input.tokenHash, expiresAt: input.expiresAt, lastSentAt: now })
    .where(and(eq(invitations.labId, input.labId), eq(invitations.id, input.invitationId)));
  await recordAudit({
    tx,
    labId: input.labId,
    actorUserId: input.actorUserId,
    action: "invitation.resent",
    targetType: "invitation",
    targetId: row.id,
    detail: {
      email: row.email,
      role: row.role,
      before: { expiresAt: row.expiresAt.toISOString() },
      after: { expiresAt: input.expiresAt.toISOString() },
    },
  });
  return { id: row.id, email: row.email, role: row.role, expiresAt: input.expiresAt, lastSentAt: now };
}

export async function revokeInvitation(tx: Tx, input: { labId: number; invitationId: number; actorUserId: number }) {
  const row = await openInvitationInLab(tx, input.labId, input.invitationId);
  await tx
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(and(eq(invitations.labId, input.labId), eq(invitations.id, input.invitationId)));
  await recordAudit({
    tx,
    labId: input.labId,
    actorUserId: input.actorUserId,
    action: "invitation.revoked",
    targetType: "invitation",
    targetId: row.id,
    detail: { email: row.email, role: row.role },
  });
  return { id: row.id, email: row.email };
}

/** What the invitation page shows: the lab, the role, and whether the link still works. */
export async function findInvitationByTokenHash({ tokenHash }: { tokenHash: string }) {
  const [row] = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
      labId: labs.id,
      labSlug: labs.slug,
      labName: labs.name,
    })
    .from(invitations)
    .innerJoin(labs, eq(labs.id, invitations.labId))
    .where(eq(invitations.tokenHash, tokenHash));
  if (!row) return null;
  const [account] = await db.select({ id: users.id }).from(users).where(eq(users.email, row.email));
  return {
    ...row,
    state: linkState({ expiresAt: row.expiresAt, usedAt: row.acceptedAt, revokedAt: row.revokedAt }),
    hasAccount: Boolean(account),
  };
}

/** The invitation with this link, locked for its acceptance; null when the link names none. */
export async function lockInvitationByTokenHash(tx: Tx, { tokenHash }: { tokenHash: string }) {
  const [inv] = await tx.select().from(invitations).where(eq(invitations.tokenHash, tokenHash)).for("update");
  return inv ?? null;
}

export type LockedInvitation = NonNullable<Awaited<ReturnType<typeof lockInvitationByTokenHash>>>;

/** The account that uses `email`, or the account `userId`, read inside the transaction. */
export async function findAccountForInvitation(tx: Tx, by: { email: string } | { userId: number }) {
  const [user] = await tx
    .select({ id: users.id, email: users.email })
    .from(users)
    .where("email" in by ? eq(users.email, by.email) : eq(users.id, by.userId));
  return user ?? null;
}

type Joiner = { newAccount: { name: string; passwordHash: string } } | { userId: number };

/**
 * Writes an accepted invitation (the caller decided it may be accepted): the new account, or the
 * existing one confirmed by the link; the membership unless already a member; the row marked
 * accepted; the audit row.
 */
export async function acceptInvitation(tx: Tx, input: { inv: LockedInvitation } & Joiner) {
  const { inv } = input;
  let userId: number;
  if ("newAccount" in input) {
    const [created] = await tx
      .insert(users)
      .values({ email: inv.email, name: input.newAccount.name, passwordHash: input.newAccount.passwordHash })
      .$returningId();
    userId = created!.id;
  } else {
    userId = input.userId;
    // The link reached this address: an account still waiting to confirm it is confirmed now.
    await tx
      .update(users)
      .set({ emailVerifiedAt: sql`COALESCE(${users.emailVerifiedAt}, CURRENT_TIMESTAMP(3))` })
      .where(eq(users.id, userId));
  }

  const [already] = await tx
    .select({ id: memberships.id, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.labId, inv.labId), eq(memberships.userId, userId)));
  if (!already) await tx.insert(memberships).values({ labId: inv.labId, userId, role: inv.role });
  await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, inv.id));
  await recordAudit({
    tx,
    labId: inv.labId,
    actorUserId: userId,
    action: "invitation.accepted",
    targetType: "invitation",
    targetId: inv.id,
    detail: {
      email: inv.email,
      role: already ? already.role : inv.role,
      newAccount: "newAccount" in input,
      ...(already ? { alreadyMember: true } : {}),
    },
  });
  const [lab] = await tx.select({ slug: labs.slug, name: labs.name }).from(labs).where(eq(labs.id, inv.labId));
  return {
    userId,
    email: inv.email,
    role: already ? already.role : inv.role,
    lab: lab!,
    alreadyMember: Boolean(already),
  };
}
