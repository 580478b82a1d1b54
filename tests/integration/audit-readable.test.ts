// The audit log people can read, over real writes: every chart and edition row names the chart
// and the edition, downloads read "downloaded", only changed fields are listed, and the log
// filters by kind, person and date and pages on the server with the filters kept.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, balloonFamilies, balloons, labs } from "@/db/schema";
import { describeAction, describeDetail } from "@/lib/audit/describe";
import { AppError } from "@/lib/errors";
import { formatDate } from "@/lib/format/dates";
import { listAudit } from "@/lib/ops/audit";
import * as chartOps from "@/lib/ops/charts";
import * as ops from "@/lib/ops/editions";
import { posterPdf } from "@/lib/ops/renders";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { as } from "../support/roles";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
const ids = { chart: 0, edition: 0, family: 0 };
const definition = (readingDistanceM: number) =>
  chartDefinitionSchema.parse({
    title: "Audit POT chart",
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId: ids.family, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    stentPlatformId: stentId,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM,
  });

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC audit", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  ids.family = fam!.id;
  await db.insert(balloons).values(
    [2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25].map((d) => ({
      labId: team.lab.id,
      familyId: ids.family,
      diameterMm: d,
    })),
  );
  ids.chart = (await chartOps.createChart(as(team.people.educator), { lab: team.lab.slug }, definition(1))).id;
  await chartOps.saveChart(as(team.people.educator), { chartId: ids.chart }, definition(2));
  ids.edition = (await ops.createEdition(as(team.people.educator), { chartId: ids.chart })).id;
  await ops.approveEdition(as(team.people.lead), { editionId: ids.edition }, { reviewed: true });
  await posterPdf(as(team.people.manager), { editionId: ids.edition });
});

afterAll(() => pool.end());

const log = (q: Record<string, unknown> = {}) => listAudit(as(team.people.manager), { lab: team.lab.slug }, q);

describe("a readable audit log", () => {
  it("names the chart and the edition on every chart and edition row; a download is 'downloaded'", async () => {
    const page = await log({ kind: "charts" });
    const actions = page.events.map((e) => e.action);
    expect(actions).toEqual([
      "edition.downloaded",
      "edition.approved",
      "edition.created",
      "chart.updated",
      "chart.created",
    ]);
    for (const e of page.events) expect(e.chart?.title, e.action).toBe("Audit POT chart");
    for (const e of page.events.filter((x) => x.action.startsWith("edition.")))
      expect(e.edition, e.action).toMatchObject({
        id: ids.edition,
        number: 1,
        shortCode: expect.stringMatching(/^[0-9A-Z]{8}$/),
      });
    expect(describeAction(actions[0]!)).toBe("Downloaded an edition's PDF");
  });

  it("lists only the fields that changed, in words", async () => {
    const updated = (await log({ kind: "charts" })).events.find((e) => e.action === "chart.updated")!;
    expect(describeDetail(updated.detail)).toEqual([{ label: "Reading distance", before: "1 m", after: "2 m" }]);
  });

  it("filters by person and by date, and pages on the server keeping the filters", async () => {
    const lead = await log({ actor: team.people.lead.id });
    expect(lead.events.map((e) => e.action)).toEqual(["edition.approved"]);
    const today = new Date().toISOString().slice(0, 10);
    expect((await log({ from: today, to: today, kind: "charts" })).events).toHaveLength(5);
    expect((await log({ to: "2020-01-01" })).events).toEqual([]);
    // The dates are the lab's calendar days: at UTC+14 the same events fall on that zone's date.
    await db.update(labs).set({ timeZone: "Pacific/Kiritimati" }).where(eq(labs.id, team.lab.id));
    try {
      const there = formatDate(new Date(), "Pacific/Kiritimati");
      expect((await log({ from: there, to: there, kind: "charts" })).events).toHaveLength(5);
      const before = formatDate(new Date(Date.now() - 86_400_000), "Pacific/Kiritimati");
      expect((await log({ from: before, to: before, kind: "charts" })).events).toEqual([]);
    } finally {
      await db.update(labs).set({ timeZone: "UTC" }).where(eq(labs.id, team.lab.id));
    }
    const first = await log({ kind: "charts", limit: 2 });
    expect(first.events).toHaveLength(2);
    const second = await log({ kind: "charts", limit: 2, before: first.olderBefore });
    const third = await log({ kind: "charts", limit: 2, before: second.olderBefore });
    expect([...first.events, ...second.events, ...third.events].map((e) => e.action)).toEqual([
      "edition.downloaded",
      "edition.approved",
      "edition.created",
      "chart.updated",
      "chart.created",
    ]);
    expect(third.olderBefore).toBeUndefined();
  });

  it("bad filters are 400 naming the field; others than managers are refused", async () => {
    for (const [q, field] of [
      [{ kind: "everything" }, "kind"],
      [{ from: "2026-13-40" }, "from"],
      [{ from: "yesterday" }, "from"],
      [{ from: "2026-05-02", to: "2026-05-01" }, "to"],
      [{ actor: "someone" }, "actor"],
    ] as const) {
      const err = (await log(q).catch((e: unknown) => e)) as AppError;
      expect(err, JSON.stringify(q)).toBeInstanceOf(AppError);
      expect(err.status).toBe(400);
      expect(JSON.stringify(err.issues)).toContain(`"${field}"`);
    }
    for (const role of ["lead", "educator", "operator"] as const) {
      const err = (await listAudit(as(team.people[role]), { lab: team.lab.slug }, {}).catch(
        (e: unknown) => e,
      )) as AppError;
      expect(err.status).toBe(403);
    }
    expect(await db.select().from(auditEvents).where(eq(auditEvents.action, "everything"))).toEqual([]);
  });
});
