import "server-only";
import { and, asc, count, eq } from "drizzle-orm";
import { AppError, notFound } from "@/lib/errors";
import type { Role } from "@/lib/permissions";
import { db } from "../index";
import { labs, memberships, users } from "../schema";
import { recordAudit, type Tx } from "./audit";
import { bumpSessionVersion } from "./sessions";

export async function findUserByEmail({ email }: { email: string }) {
  const [row] = await db.select().from(users).where(eq(users.email, email.toLowerCase()));
  return row ?? null;
}

export async function findUserById({ id }: { id: number }) {
  const [row] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.id, id));
  return row ?? null;
}

/** The labs a person belongs to, with their role in each (for the lab switcher). */
export async function listLabsForUser({ userId }: { userId: number }) {
  return db
    .select({ id: labs.id, slug: labs.slug, name: labs.name, role: memberships.role })
    .from(memberships)
    .innerJoin(labs, eq(labs.id, memberships.labId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(labs.name));
}

/** A lab, by slug or id, with the person's role in it; the role is null when they are not a member. */
export async function findLabWithRole({ userId, ...lab }: { userId: number } & ({ slug: string } | { labId: number })) {
  const [row] = await db
    .select({
      id: labs.id,
      slug: labs.slug,
      name: labs.name,
      stockRevision: labs.stockRevision,
      isDemo: labs.isDemo,
      timeZone: labs.timeZone,
      numberFormat: labs.numberFormat,
      contactLine: labs.contactLine,
      role: memberships.role,
    })
    .from(labs)
    .leftJoin(memberships, and(eq(memberships.labId, labs.id), eq(memberships.userId, userId)))
    .where("slug" in lab ? eq(labs.slug, lab.slug) : eq(labs.id, lab.labId));
  // The column's collation folds case and pads; a slug names a lab only when it is exactly its slug.
  if (!row || ("slug" in lab && row.slug !== lab.slug)) return null;
  return { ...row, role: (row.role ?? null) as Role | null };
}

export type MemberRow = Awaited<ReturnType<typeof listMembers>>[number];

export async function listMembers({ labId }: { labId: number }) {
  return db
    .select({
      id: memberships.id,
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      notifyStale: memberships.notifyStale,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.labId, labId))
    .orderBy(asc(users.name), asc(memberships.id));
}

async function memberInLab(tx: Tx, labId: number, membershipId: number) {
  const [row] = await tx
    .select({
      id: memberships.id,
      userId: memberships.userId,
      role: memberships.role,
      name: users.name,
      email: users.email,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.labId, labId), eq(memberships.id, membershipId)));
  if (!row) throw notFound("That member");
  return row;
}

async function managerCount(tx: Tx, labId: number): Promise<number> {
  const [row] = await tx
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.labId, labId), eq(memberships.role, "manager")));
  return Number(row?.n ?? 0);
}

const lastManager = (name: string, doing: string) =>
  new AppError(
    "conflict",
    `${name} is the lab's only manager and cannot be ${doing}. Make another member a manager first.`,
    [{ path: ["role"], message: "A lab keeps at least one manager." }],
  );

export async function changeMemberRole(
  tx: Tx,
  {
    labId,
    membershipId,
    role,
    actorUserId,
  }: {
    labId: number;
    membershipId: number;
    role: Role;
    actorUserId: number;
  },
) {
  const member = await memberInLab(tx, labId, membershipId);
  if (member.role === role) return { ...member, changed: false };
  if (member.role === "manager" && (await managerCount(tx, labId)) <= 1)
    throw lastManager(member.name, "given another role");
  await tx
    .update(memberships)
    .set({ role })
    .where(and(eq(memberships.labId, labId), eq(memberships.id, membershipId)));
  await recordAudit({
    tx,
    labId,
    actorUserId,
    action: "member.role_changed",
    targetType: "membership",
    targetId: membershipId,
    detail: { member: member.email, before: { role: member.role }, after: { role } },
  });
  return { ...member, role, changed: true };
}

export async function removeMember(
  tx: Tx,
  {
    labId,
    membershipId,
    actorUserId,
  }: {
    labId: number;
    membershipId: number;
    actorUserId: number;
  },
) {
  const member = await memberInLab(tx, labId, membershipId);
  if (member.role === "manager" && (await managerCount(tx, labId)) <= 1) throw lastManager(member.name, "removed");
  await tx.delete(memberships).where(and(eq(memberships.labId, labId), eq(memberships.id, membershipId)));
  // Removed from a lab: every session of that person ends, so no open tab keeps reading it.
  await bumpSessionVersion({ tx, userId: member.userId });
  await recordAudit({
    tx,
    labId,
    actorUserId,
    action: "member.removed",
    targetType: "membership",
    targetId: membershipId,
    detail: { member: member.email, name: member.name, before: { role: member.role }, after: null },
  });
  return member;
}

/** Whether this member gets the stale-copy e-mail (managers always do; educators may opt in). */
export async function getStaleMailSetting({ labId, userId }: { labId: number; userId: number }) {
  const [row] = await db
    .select({ notifyStale: memberships.notifyStale })
    .from(memberships)
    .where(and(eq(memberships.labId, labId), eq(memberships.userId, userId)));
  return row?.notifyStale ?? false;
}

export async function setStaleMailSetting(
  tx: Tx,
  { labId, userId, on }: { labId: number; userId: number; on: boolean },
) {
  await tx
    .update(memberships)
    .set({ notifyStale: on })
    .where(and(eq(memberships.labId, labId), eq(memberships.userId, userId)));
  await recordAudit({
    tx,
    labId,
    actorUserId: userId,
    action: on ? "member.stale_mail_on" : "member.stale_mail_off",
    targetType: "user",
    targetId: userId,
  });
}
