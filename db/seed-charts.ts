// Demo charts, editions, rooms and postings for the invented demo lab. Idempotent: a chart or
// room that already exists (by title or name) is left as it is. Goes through the same query
// functions and write path as the app, so fingerprints, approvals and statuses are real.
import { and, eq } from "drizzle-orm";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import type { Database } from "./index";
import { createChart } from "./queries/charts";
import { approveEdition, createEdition } from "./queries/editions";
import { recordPosting } from "./queries/postings";
import { createRoom } from "./queries/rooms";
import { labWrite } from "@/lib/ops/write";
import { balloonFamilies, charts, labs, rooms, stentPlatforms, users } from "./schema";
import { DEMO_CHARTS as CHARTS } from "./demo-charts";

const ROOMS = ["Procedure room 1", "Procedure room 2", "Control room"];

/** `slug` and `email` let a test seed the same charts into a lab and people of its own. */
export async function seedDemoCharts(
  db: Database,
  { slug = "demo", email = (role: string) => `${role}@forkwall.test` } = {},
): Promise<void> {
  const [lab] = await db.select({ id: labs.id }).from(labs).where(eq(labs.slug, slug));
  if (!lab) return;
  const person = async (email: string) => {
    const [u] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, email));
    return u!;
  };
  const [educator, lead, manager, operator] = await Promise.all(
    ["educator", "lead", "manager", "operator"].map((r) => person(email(r))),
  );
  const familyId = async (name: string) =>
    (
      await db
        .select({ id: balloonFamilies.id })
        .from(balloonFamilies)
        .where(and(eq(balloonFamilies.labId, lab.id), eq(balloonFamilies.name, name)))
    )[0]?.id;
  const nc = await familyId("NC family A (illustrative)");
  const sc = await familyId("SC family B (illustrative)");
  const [stentRow] = await db
    .select({ id: stentPlatforms.id })
    .from(stentPlatforms)
    .where(and(eq(stentPlatforms.labId, lab.id), eq(stentPlatforms.name, "DES platform X (illustrative)")));
  if (!nc || !sc || !stentRow) return;

  const roomIds = new Map<string, number>();
  for (const name of ROOMS) {
    const [found] = await db
      .select({ id: rooms.id })
      .from(rooms)
      .where(and(eq(rooms.labId, lab.id), eq(rooms.name, name)));
    roomIds.set(
      name,
      found?.id ?? (await labWrite(lab.id, (tx) => createRoom(tx, { labId: lab.id, name, actor: manager! }))).id,
    );
  }

  for (const demo of CHARTS) {
    const [exists] = await db
      .select({ id: charts.id })
      .from(charts)
      .where(and(eq(charts.labId, lab.id), eq(charts.title, demo.title)));
    if (exists) continue;
    const definition = chartDefinitionSchema.parse(demo.definition({ nc, sc, stent: stentRow.id }));
    const { id: chartId } = await labWrite(lab.id, (tx) =>
      createChart(tx, { labId: lab.id, userId: educator!.id, definition }),
    );
    const edition = await labWrite(lab.id, (tx) => createEdition(tx, { labId: lab.id, chartId, actor: educator! }));
    if (!demo.approveBy) continue;
    await labWrite(lab.id, (tx) =>
      approveEdition(tx, { labId: lab.id, editionId: edition.id, actor: demo.approveBy === "lead" ? lead! : manager! }),
    );
    for (const room of demo.postIn)
      await labWrite(lab.id, (tx) =>
        recordPosting(tx, { labId: lab.id, editionId: edition.id, roomId: roomIds.get(room)!, actor: operator! }),
      );
  }
}
