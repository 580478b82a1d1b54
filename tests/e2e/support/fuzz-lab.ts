// Run as its own process (tsx, react-server conditions) by the fuzz: seeds a lab of the fuzz's
// own, with its own four people and the demo lab's stock, charts, editions and rooms, so
// generated requests that happen to be valid never change what the other browser tests read.
// Prints {"slug", "emails"} as JSON.
import { randomBytes } from "node:crypto";
import { loadLocalEnv } from "../../../db/local-env";

loadLocalEnv();
const { db, pool } = await import("@/db");
const { labs, memberships, users } = await import("@/db/schema");
const { DEMO_PASSWORD } = await import("@/db/seed");
const { seedDemoStock } = await import("@/db/seed-stock");
const { seedDemoCharts } = await import("@/db/seed-charts");
const { hashPassword } = await import("@/lib/auth/password");

const tag = randomBytes(4).toString("hex");
const slug = `fuzz-${tag}`;
const email = (role: string) => `fuzz-${role}-${tag}@example.test`;
const [lab] = await db
  .insert(labs)
  .values({ slug, name: `Fuzz lab ${tag} (illustrative)` })
  .$returningId();
const passwordHash = await hashPassword(DEMO_PASSWORD);
for (const role of ["manager", "lead", "educator", "operator"] as const) {
  const [user] = await db
    .insert(users)
    .values({ email: email(role), name: `Fuzz ${role}`, passwordHash })
    .$returningId();
  await db.insert(memberships).values({ labId: lab!.id, userId: user!.id, role });
}
// The demo lab's stock is the template: its slug maps to this lab.
await seedDemoStock(db, new Map([["demo", lab!.id]]));
await seedDemoCharts(db, { slug, email });
await pool.end();
console.log(
  JSON.stringify({
    slug,
    emails: Object.fromEntries(["manager", "lead", "educator", "operator"].map((r) => [r, email(r)])),
  }),
);
