// Demo data: an invented lab with invented people. Idempotent: a second run adds nothing.
import { and, eq } from "drizzle-orm";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import type { Role } from "@/lib/permissions";
import type { Database } from "./index";
import { labs, memberships, users } from "./schema";
import { seedDemoCharts } from "./seed-charts";
import { seedDemoStock } from "./seed-stock";

export const DEMO_PASSWORD = "forkwall-demo-2026";

export const DEMO_LABS = [
  { slug: "demo", name: "Demo Heart Centre Cath Lab (illustrative)" },
  { slug: "demo-north", name: "Demo North Cath Lab (illustrative)" },
] as const;

export const DEMO_PEOPLE: {
  email: string;
  name: string;
  roles: Partial<Record<(typeof DEMO_LABS)[number]["slug"], Role>>;
}[] = [
  {
    email: "manager@forkwall.test",
    name: "Morgan Avery (demo manager)",
    roles: { demo: "manager", "demo-north": "manager" },
  },
  {
    email: "lead@forkwall.test",
    name: "Dr Lee Okafor (demo medical lead)",
    roles: { demo: "lead", "demo-north": "lead" },
  },
  {
    email: "educator@forkwall.test",
    name: "Eden Sørlie (demo educator)",
    roles: { demo: "educator", "demo-north": "educator" },
  },
  { email: "operator@forkwall.test", name: "Dr Omar Reyes (demo operator)", roles: { demo: "operator" } },
];

async function upsertLab(db: Database, slug: string, name: string): Promise<number> {
  const [found] = await db.select({ id: labs.id }).from(labs).where(eq(labs.slug, slug));
  if (found) {
    await db.update(labs).set({ isDemo: true }).where(eq(labs.id, found.id));
    return found.id;
  }
  const [row] = await db.insert(labs).values({ slug, name, isDemo: true }).$returningId();
  return row!.id;
}

async function upsertUser(db: Database, email: string, name: string): Promise<number> {
  const [found] = await db.select().from(users).where(eq(users.email, email));
  if (found) {
    // Keep the documented demo password working even if someone changed it.
    if (!(await verifyPassword(DEMO_PASSWORD, found.passwordHash))) {
      await db
        .update(users)
        .set({ passwordHash: await hashPassword(DEMO_PASSWORD) })
        .where(eq(users.id, found.id));
    }
    return found.id;
  }
  const [row] = await db
    .insert(users)
    .values({ email, name, passwordHash: await hashPassword(DEMO_PASSWORD) })
    .$returningId();
  return row!.id;
}

export async function seedDemo(db: Database): Promise<void> {
  const labIds = new Map<string, number>();
  for (const lab of DEMO_LABS) labIds.set(lab.slug, await upsertLab(db, lab.slug, lab.name));
  for (const person of DEMO_PEOPLE) {
    const userId = await upsertUser(db, person.email, person.name);
    for (const [slug, role] of Object.entries(person.roles)) {
      const labId = labIds.get(slug)!;
      const [m] = await db
        .select({ id: memberships.id })
        .from(memberships)
        .where(and(eq(memberships.labId, labId), eq(memberships.userId, userId)));
      if (!m) await db.insert(memberships).values({ labId, userId, role: role!, notifyStale: role === "educator" });
    }
  }
  await seedDemoStock(db, labIds);
  await seedDemoCharts(db);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { db, pool } = await import("./index");
  await seedDemo(db);
  await pool.end();
  console.log("demo data seeded");
}
