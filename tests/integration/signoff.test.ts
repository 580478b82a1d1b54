// Sign-off that means something: a stated review, the medical lead (managers only where the
// lab's rules grant it), and never anyone who changed the chart since its last approval.
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, balloonFamilies, balloons, editions } from "@/db/schema";
import { AppError } from "@/lib/errors";
import * as chartOps from "@/lib/ops/charts";
import * as ops from "@/lib/ops/editions";
import type { Caller } from "@/lib/ops/caller";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { labWithTeam } from "./support/fixtures";
import { approveEdition } from "./support/writes";

let team: Awaited<ReturnType<typeof labWithTeam>>;
let familyId = 0;
type Person = { id: number; email: string; name: string };
const as = (p: Person): Caller => ({ kind: "user", user: { id: p.id, email: p.email, name: p.name } });

const definition = (title: string, notes = "") =>
  chartDefinitionSchema.parse({
    title,
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
    ...(notes ? { notes } : {}),
  });

async function refusal(p: Promise<unknown>) {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

async function footprint() {
  const [a] = await db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.labId, team.lab.id));
  const rows = await db
    .select({ id: editions.id, status: editions.status, approvedAt: editions.approvedAt })
    .from(editions)
    .where(eq(editions.labId, team.lab.id));
  return { audit: a!.n, editions: rows };
}

beforeAll(async () => {
  team = await labWithTeam();
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC sign-off", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  familyId = fam!.id;
  await db
    .insert(balloons)
    .values([2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25].map((d) => ({ labId: team.lab.id, familyId, diameterMm: d })));
});

afterAll(() => pool.end());

describe("approval", () => {
  it("needs reviewed: true (400 naming it), changing nothing", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("A"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const before = await footprint();
    for (const body of [undefined, {}, { reviewed: false }, { reviewed: "yes" }, { reviewed: true, extra: 1 }]) {
      const err = await refusal(ops.approveEdition(as(team.people.lead), { editionId: ed.id }, body));
      expect(err.status, JSON.stringify(body)).toBe(400);
      expect(JSON.stringify(err.issues)).toMatch(body && "extra" in body ? /extra/ : /reviewed/);
    }
    expect(await footprint()).toEqual(before);
    const ok = await ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true });
    expect(ok.status).toBe("approved");
  });

  it("is refused to managers while the lab's rules do not grant it (403), changing nothing", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("B"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const before = await footprint();
    const err = await refusal(ops.approveEdition(as(team.people.manager), { editionId: ed.id }, { reviewed: true }));
    expect(err.status).toBe(403);
    expect(await footprint()).toEqual(before);
  });

  it("is refused (403) to anyone who changed the chart since its last approval, not only the edition's creator", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("C"),
    );
    const first = await ops.createEdition(as(team.people.educator), { chartId });
    await ops.approveEdition(as(team.people.lead), { editionId: first.id }, { reviewed: true });
    // The manager rewrites the chart; the educator presses "Create edition".
    await chartOps.saveChart(as(team.people.manager), { chartId }, definition("C", "Manager's words"));
    const second = await ops.createEdition(as(team.people.educator), { chartId });
    const before = await footprint();
    const err = await refusal(approveEdition({ labId: team.lab.id, editionId: second.id, actor: team.people.manager }));
    expect(err.status).toBe(403);
    expect(err.message).toMatch(/changed this chart since its last approved edition/);
    expect(await footprint()).toEqual(before);
    // Someone who did not touch it may approve it.
    const ok = await ops.approveEdition(as(team.people.lead), { editionId: second.id }, { reviewed: true });
    expect(ok.superseded).toEqual([first.number]);
  });

  it("counts a change made before any approval, and the creator stays refused", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.manager),
      { lab: team.lab.slug },
      definition("D"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    expect(
      (await refusal(approveEdition({ labId: team.lab.id, editionId: ed.id, actor: team.people.manager }))).status,
    ).toBe(403);
    expect(
      (await refusal(approveEdition({ labId: team.lab.id, editionId: ed.id, actor: team.people.educator }))).status,
    ).toBe(403);
  });
});
