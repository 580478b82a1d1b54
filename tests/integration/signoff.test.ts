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

describe("returned, repeated drafts and withdrawal reasons", () => {
  it("sends a draft back as returned with its reason; a returned edition cannot be approved (409)", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("E"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    const back = await ops.rejectEdition(as(team.people.lead), { editionId: ed.id }, { reason: "Columns too narrow" });
    expect(back).toMatchObject({ status: "returned", rejectionReason: "Columns too narrow" });
    const [row] = await db.select().from(editions).where(eq(editions.id, ed.id));
    expect(row).toMatchObject({ status: "returned", rejectionReason: "Columns too narrow" });
    const before = await footprint();
    const err = await refusal(ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true }));
    expect(err.status).toBe(409);
    expect(err.message).toMatch(/sent back/);
    // Sending it back twice is a conflict too, and the manager (no approval rule) may not send back.
    expect(
      (await refusal(ops.rejectEdition(as(team.people.lead), { editionId: ed.id }, { reason: "Again" }))).status,
    ).toBe(409);
    expect(
      (await refusal(ops.rejectEdition(as(team.people.manager), { editionId: ed.id }, { reason: "Again" }))).status,
    ).toBe(403);
    expect(await footprint()).toEqual(before);
    // A returned edition does not count as the identical draft: the next one is new.
    const again = await ops.createEdition(as(team.people.educator), { chartId });
    expect(again.id).not.toBe(ed.id);
    expect(again.reused).toBe(false);
  });

  it("answers the identical waiting draft instead of a second one", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("F"),
    );
    const first = await ops.createEdition(as(team.people.educator), { chartId });
    expect(first.reused).toBe(false);
    const before = await footprint();
    const second = await ops.createEdition(as(team.people.manager), { chartId });
    expect(second).toMatchObject({ id: first.id, number: first.number, reused: true });
    expect(await footprint()).toEqual(before);
    // A changed chart gives a new draft.
    await chartOps.saveChart(as(team.people.educator), { chartId }, definition("F", "New notes"));
    const third = await ops.createEdition(as(team.people.educator), { chartId });
    expect(third.id).not.toBe(first.id);
    expect(third.number).toBe(first.number + 1);
  });

  it("refuses a withdrawal without a reason (400 naming reason), changing nothing", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("G"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    await ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true });
    const before = await footprint();
    for (const body of [undefined, {}, { reason: "" }, { reason: "  " }, { reason: 5 }]) {
      const err = await refusal(ops.withdrawEdition(as(team.people.manager), { editionId: ed.id }, body));
      expect(err.status, JSON.stringify(body)).toBe(400);
      expect(JSON.stringify(err.issues)).toMatch(/reason/);
    }
    expect(await footprint()).toEqual(before);
    const ok = await ops.withdrawEdition(as(team.people.manager), { editionId: ed.id }, { reason: "Wrong family" });
    expect(ok).toMatchObject({ status: "withdrawn", was: "approved" });
  });

  it("the database refuses to move a returned edition anywhere or to change its reason", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("H"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    await ops.rejectEdition(as(team.people.lead), { editionId: ed.id }, { reason: "Not yet" });
    for (const set of [{ status: "approved" as const }, { status: "draft" as const }, { rejectionReason: "Other" }]) {
      const err = await db
        .update(editions)
        .set(set)
        .where(eq(editions.id, ed.id))
        .then(
          () => null,
          (e: Error) => e,
        );
      expect(err, JSON.stringify(set)).not.toBeNull();
    }
  });
});
