// Sign-off that means something: a stated review, the medical lead (managers only where the
// lab's rules grant it), and never anyone who changed the chart since its last approval.
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, balloonFamilies, balloons, editions, labRules } from "@/db/schema";
import * as chartOps from "@/lib/ops/charts";
import * as ops from "@/lib/ops/editions";
import * as rulesOps from "@/lib/ops/lab-rules";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { getCheckByToken } from "@/lib/ops/check";
import { as } from "../support/roles";
import { refusal } from "../support/refusal";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
let familyId = 0;

const definition = (title: string, notes = "") =>
  chartDefinitionSchema.parse({
    title,
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    stentPlatformId: stentId,
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
    ...(notes ? { notes } : {}),
  });

async function footprint() {
  const [a] = await db.select({ n: count() }).from(auditEvents).where(eq(auditEvents.labId, team.lab.id));
  const rows = await db
    .select({ id: editions.id, status: editions.status, approvedAt: editions.approvedAt })
    .from(editions)
    .where(eq(editions.labId, team.lab.id));
  const rules = await db.select().from(labRules).where(eq(labRules.labId, team.lab.id));
  return { audit: a!.n, editions: rows, rules };
}

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
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
    await rulesOps.setLabRules(as(team.people.lead), { lab: team.lab.slug }, { managersMayApprove: true });
    // The manager rewrites the chart; the educator presses "Create edition".
    await chartOps.saveChart(as(team.people.manager), { chartId }, definition("C", "Manager's words"));
    const second = await ops.createEdition(as(team.people.educator), { chartId });
    const before = await footprint();
    const err = await refusal(
      ops.approveEdition(as(team.people.manager), { editionId: second.id }, { reviewed: true }),
    );
    expect(err.status).toBe(403);
    expect(err.message).toMatch(/Since this chart's last approved edition you changed the chart/);
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
    const manager = await refusal(
      ops.approveEdition(as(team.people.manager), { editionId: ed.id }, { reviewed: true }),
    );
    expect(manager.status).toBe(403);
    expect(manager.message).toMatch(/you changed the chart \(Created a chart\)/);
    // Leave the lab as the other tests expect it: no rules recorded.
    await db.delete(labRules).where(eq(labRules.labId, team.lab.id));
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

describe("the lab's rules", () => {
  it("every member reads them; the defaults are a 12-month review and no approval by managers", async () => {
    for (const role of ["manager", "lead", "educator", "operator"] as const)
      expect(await rulesOps.getLabRules(as(team.people[role]), { lab: team.lab.slug })).toMatchObject({
        reviewPeriodMonths: 12,
        managersMayApprove: false,
        exceptions: [],
        revision: 0,
      });
    expect((await refusal(rulesOps.getLabRules(as(team.people.outsider), { lab: team.lab.slug }))).status).toBe(404);
  });

  it("only the medical lead changes them (403 for the others), bad input is 400 naming the field, and nothing changes", async () => {
    const before = await footprint();
    for (const role of ["manager", "educator", "operator"] as const) {
      const err = await refusal(
        rulesOps.setLabRules(as(team.people[role]), { lab: team.lab.slug }, { managersMayApprove: true }),
      );
      expect(err.status, role).toBe(403);
    }
    const bad: [unknown, RegExp][] = [
      [{ managersMayApprove: true, approvers: "all" }, /approvers/],
      [{ reviewPeriodMonths: 0 }, /reviewPeriodMonths/],
      [{ reviewPeriodMonths: 6.5 }, /reviewPeriodMonths/],
      [{ managersMayApprove: "yes" }, /managersMayApprove/],
      [{}, /at least one rule/],
    ];
    for (const [body, field] of bad) {
      const err = await refusal(rulesOps.setLabRules(as(team.people.lead), { lab: team.lab.slug }, body));
      expect(err.status, JSON.stringify(body)).toBe(400);
      expect(JSON.stringify(err.issues), JSON.stringify(body)).toMatch(field);
    }
    expect(await footprint()).toEqual(before);
  });

  it("a lead's change is audited with only what changed; a repeat writes nothing", async () => {
    const res = await rulesOps.setLabRules(as(team.people.lead), { lab: team.lab.slug }, { reviewPeriodMonths: 6 });
    expect(res).toMatchObject({
      rules: { reviewPeriodMonths: 6, managersMayApprove: false },
      revision: 1,
      changed: ["reviewPeriodMonths"],
    });
    const rows = await db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.labId, team.lab.id))
      .then((r) => r.filter((e) => e.action === "lab.rules_updated"));
    expect(rows.at(-1)).toMatchObject({
      actorUserId: team.people.lead.id,
      detail: { before: { reviewPeriodMonths: 12 }, after: { reviewPeriodMonths: 6 } },
    });
    const before = await footprint();
    await rulesOps.setLabRules(as(team.people.lead), { lab: team.lab.slug }, { reviewPeriodMonths: 6 });
    expect(await footprint()).toEqual(before);
  });

  it("sets each approval's review-by date from the review period, and lets managers approve once granted", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("R"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    expect(
      (await refusal(ops.approveEdition(as(team.people.manager), { editionId: ed.id }, { reviewed: true }))).status,
    ).toBe(403);
    await rulesOps.setLabRules(
      as(team.people.lead),
      { lab: team.lab.slug },
      { managersMayApprove: true, reviewPeriodMonths: 3 },
    );
    const ok = await ops.approveEdition(as(team.people.manager), { editionId: ed.id }, { reviewed: true });
    const [row] = await db.select().from(editions).where(eq(editions.id, ed.id));
    const expected = new Date(row!.approvedAt!);
    expected.setUTCMonth(expected.getUTCMonth() + 3);
    expect(row!.reviewBy?.toISOString().slice(0, 10)).toBe(expected.toISOString().slice(0, 10));
    expect(ok.reviewBy).toBe(row!.reviewBy!.toISOString());
    // The database keeps it with the approval.
    const err = await db
      .update(editions)
      .set({ reviewBy: new Date("2099-01-01T00:00:00Z") })
      .where(eq(editions.id, ed.id))
      .then(
        () => null,
        (e: Error) => e,
      );
    expect(err).not.toBeNull();
    // Granted, a manager who changed the chart is still refused.
    await chartOps.saveChart(as(team.people.manager), { chartId }, definition("R", "Manager's wording"));
    const next = await ops.createEdition(as(team.people.educator), { chartId });
    expect(
      (await refusal(ops.approveEdition(as(team.people.manager), { editionId: next.id }, { reviewed: true }))).status,
    ).toBe(403);
    await rulesOps.setLabRules(
      as(team.people.lead),
      { lab: team.lab.slug },
      { managersMayApprove: false, reviewPeriodMonths: 12 },
    );
  });
});

describe("the check's action", () => {
  const check = async (token: string) => (await getCheckByToken({ token }))!;

  it("keep, then replace for the older copy, then take-down for both once the new one is withdrawn", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("K"),
    );
    const first = await ops.createEdition(as(team.people.educator), { chartId });
    const [firstRow] = await db.select().from(editions).where(eq(editions.id, first.id));
    expect(await check(firstRow!.checkToken)).toMatchObject({ status: "draft", action: "take-down" });
    await ops.approveEdition(as(team.people.lead), { editionId: first.id }, { reviewed: true });
    expect(await check(firstRow!.checkToken)).toMatchObject({ status: "current", action: "keep" });

    // A clinical change (the law): a wording-only change would leave the first copy current.
    await chartOps.saveChart(as(team.people.educator), { chartId }, { ...definition("K"), law: { law: "square" } });
    const second = await ops.createEdition(as(team.people.educator), { chartId });
    await ops.approveEdition(as(team.people.lead), { editionId: second.id }, { reviewed: true });
    const [secondRow] = await db.select().from(editions).where(eq(editions.id, second.id));
    expect(await check(firstRow!.checkToken)).toMatchObject({
      status: "superseded",
      action: "replace",
      currentEdition: { number: second.number },
    });
    expect(await check(secondRow!.checkToken)).toMatchObject({ status: "current", action: "keep" });

    await ops.withdrawEdition(as(team.people.manager), { editionId: second.id }, { reason: "Wrong law" });
    expect(await check(secondRow!.checkToken)).toMatchObject({ status: "withdrawn", action: "take-down" });
    // The older copy no longer says "replace": nothing approved can replace it.
    expect(await check(firstRow!.checkToken)).toMatchObject({
      status: "superseded",
      action: "take-down",
      currentEdition: null,
    });
  });

  it("review once the review-by date has passed (a 1-month period, checked a month and more later)", async () => {
    const { id: chartId } = await chartOps.createChart(
      as(team.people.educator),
      { lab: team.lab.slug },
      definition("V"),
    );
    const ed = await ops.createEdition(as(team.people.educator), { chartId });
    await ops.approveEdition(as(team.people.lead), { editionId: ed.id }, { reviewed: true });
    const [row] = await db.select().from(editions).where(eq(editions.id, ed.id));
    const view = await check(row!.checkToken);
    expect(view).toMatchObject({ status: "current", action: "keep" });
    expect(view.reviewBy?.getTime()).toBe(row!.reviewBy!.getTime());
    // The same rule with the clock past the stored date (the pure function is the one the query calls).
    const { copyAction } = await import("@/lib/editions/action");
    expect(
      copyAction({
        status: view.status,
        reviewBy: view.reviewBy,
        replacement: null,
        now: new Date(row!.reviewBy!.getTime() + 1),
      }),
    ).toBe("review");
  });
});
