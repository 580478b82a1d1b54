// Each integration file builds its own lab and people, so the seeded demo data that the browser
// tests rely on is never touched.
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { labs, memberships, stentPlatforms, stentSizes, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { Role } from "@/lib/permissions";

export const FIXTURE_PASSWORD = "fixture-password-2026";
let hash: Promise<string> | undefined;

export const unique = (prefix: string) => `${prefix}-${Date.now().toString(36)}${randomBytes(3).toString("hex")}`;

export async function createLab(prefix = "it-lab") {
  const slug = unique(prefix);
  const [row] = await db
    .insert(labs)
    .values({ slug, name: `Integration ${slug} (illustrative)` })
    .$returningId();
  return { id: row!.id, slug, name: `Integration ${slug} (illustrative)` };
}

export async function createUser(prefix = "person") {
  hash ??= hashPassword(FIXTURE_PASSWORD);
  const email = `${unique(prefix)}@example.test`;
  const name = `Fixture ${prefix}`;
  const [row] = await db
    .insert(users)
    .values({ email, name, passwordHash: await hash })
    .$returningId();
  return { id: row!.id, email, name };
}

export async function addMember(labId: number, userId: number, role: Role) {
  const [row] = await db.insert(memberships).values({ labId, userId, role }).$returningId();
  return row!.id;
}

/** A lab with one person in each role, plus an outsider who manages another lab. */
export async function labWithTeam() {
  const lab = await createLab();
  const other = await createLab("it-other");
  const people = {} as Record<Role | "outsider", { id: number; email: string; name: string; membershipId: number }>;
  for (const role of ["manager", "lead", "educator", "operator"] as const) {
    const u = await createUser(role);
    people[role] = { ...u, membershipId: await addMember(lab.id, u.id, role) };
  }
  const o = await createUser("outsider");
  people.outsider = { ...o, membershipId: await addMember(other.id, o.id, "manager") };
  return { lab, other, people };
}

export async function sessionUser(id: number) {
  const [u] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.id, id));
  return u!;
}

/**
 * An invented stent platform (illustrative) whose limits no fixture POT balloon reaches: POT
 * charts need one (the lab rule "POT checked against a stent platform") unless excepted.
 */
export async function stentPlatformFor(labId: number): Promise<number> {
  const [p] = await db
    .insert(stentPlatforms)
    .values({ labId, name: `DES fixture ${Math.random().toString(36).slice(2, 8)}` })
    .$returningId();
  await db.insert(stentSizes).values(
    [2, 2.25, 2.5, 2.75, 3, 3.5, 4, 4.5, 5].map((nominalMm) => ({
      labId,
      platformId: p!.id,
      nominalMm,
      maxPostDilatationMm: 6,
    })),
  );
  return p!.id;
}
