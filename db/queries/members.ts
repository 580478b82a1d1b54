import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Role } from "@/lib/permissions";
import { db } from "../index";
import { labs, memberships, users } from "../schema";

export async function findUserByEmail({ email }: { email: string }) {
  const [row] = await db.select().from(users).where(eq(users.email, email.toLowerCase()));
  return row ?? null;
}

export async function findUserById({ id }: { id: number }) {
  const [row] = await db.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, id));
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

/** A lab by slug with the person's role in it; the role is null when they are not a member. */
export async function findLabWithRole({ slug, userId }: { slug: string; userId: number }) {
  const [row] = await db
    .select({ id: labs.id, slug: labs.slug, name: labs.name, stockRevision: labs.stockRevision, role: memberships.role })
    .from(labs)
    .leftJoin(memberships, and(eq(memberships.labId, labs.id), eq(memberships.userId, userId)))
    .where(eq(labs.slug, slug));
  return row ? { ...row, role: (row.role ?? null) as Role | null } : null;
}

export async function findLabByIdWithRole({ labId, userId }: { labId: number; userId: number }) {
  const [row] = await db
    .select({ id: labs.id, slug: labs.slug, name: labs.name, stockRevision: labs.stockRevision, role: memberships.role })
    .from(labs)
    .leftJoin(memberships, and(eq(memberships.labId, labs.id), eq(memberships.userId, userId)))
    .where(eq(labs.id, labId));
  return row ? { ...row, role: (row.role ?? null) as Role | null } : null;
}
