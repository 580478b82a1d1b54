// What a status means, as a client reads it on MariaDB: a wording-only change keeps posted copies
// current and names the reworded edition. Only the session (who is calling) is stood in for.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, balloons, charts, editions, postings, staleNotices } from "@/db/schema";
import { env } from "@/lib/env";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { POST as createEditionRoute } from "@/app/api/v1/charts/[id]/editions/route";
import { GET as checkRoute } from "@/app/api/v1/check/[token]/route";
import { POST as archiveRoute } from "@/app/api/v1/charts/[id]/archive/route";
import { POST as restoreRoute } from "@/app/api/v1/charts/[id]/restore/route";
import { GET as listChartsRoute } from "@/app/api/v1/labs/[slug]/charts/route";
import type { CheckJson } from "@/lib/editions/check-json";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { createChart, createRoom, recordPosting } from "./support/writes";
import { as } from "../support/roles";
import { callJson } from "../support/routes";
import { signOffSteps } from "./support/sign-off";

vi.mock("@/lib/auth/session", () => import("../support/session"));

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
let chartId = 0;

const { newEdition, approve, patch } = signOffSteps(
  () => team.people,
  () => chartId,
);

let familyId = 0;

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC status", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  familyId = fam!.id;
  await db
    .insert(balloons)
    .values(
      [2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25, 4.5].map((d) => ({ labId: team.lab.id, familyId, diameterMm: d })),
    );
  const definition = chartDefinitionSchema.parse({
    title: "Status chart",
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    stentPlatformId: stentId,
    paper: "A4",
    orientation: "portrait",
    readingDistanceM: 1,
  });
  chartId = (await createChart({ labId: team.lab.id, userId: team.people.educator.id, definition })).id;
});

afterAll(() => pool.end());

const tokenOf = async (id: number) =>
  (await db.select({ t: editions.checkToken }).from(editions).where(eq(editions.id, id)))[0]!.t;
const check = async (id: number) => {
  as(null);
  const r = await callJson<{ token: string }, CheckJson>(checkRoute, { token: await tokenOf(id) }, "GET");
  expect(r.status).toBe(200);
  return r.json;
};
const notices = async () => db.select().from(staleNotices).where(eq(staleNotices.labId, team.lab.id));

describe("wording-only changes", () => {
  it("a notes change keeps the posted copy current; the reworded draft, then its approval, are named; copies stay keep", async () => {
    const first = await newEdition();
    await approve(first);
    const room = await createRoom({
      labId: team.lab.id,
      name: "Room 1",
      actor: { id: team.people.manager.id, name: "M" },
    });
    await recordPosting({
      labId: team.lab.id,
      editionId: first,
      roomId: (room as { id: number }).id,
      actor: { id: team.people.manager.id, name: "M" },
    });
    expect(await check(first)).toMatchObject({
      status: "current",
      action: "keep",
      reworded: false,
      rewordedEdition: null,
    });

    await patch({ notes: "Measure at the reference segments." });
    expect(await check(first)).toMatchObject({ status: "current", action: "keep", reworded: false });

    const second = await newEdition();
    expect(await check(first)).toMatchObject({
      status: "current",
      action: "keep",
      reworded: true,
      rewordedEdition: { number: 2, status: "draft" },
    });

    await approve(second);
    expect(await check(first)).toMatchObject({
      status: "current",
      action: "keep",
      reworded: true,
      rewordedEdition: { number: 2, status: "approved" },
    });
    const [posting] = await db.select().from(postings).where(eq(postings.editionId, first));
    expect(posting!.lastStatus).toBe("current");
    expect(await notices()).toEqual([]);

    // A size change is clinical: both copies' numbers no longer match.
    await patch({ lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5, 4], cols: [2.5, 3] }] });
    expect(await check(first)).toMatchObject({ status: "superseded", action: "take-down" });
    expect(await check(second)).toMatchObject({ status: "outdated", action: "take-down", reworded: false });
    expect((await notices()).length).toBe(1);
  });
});

describe("archiving a chart", () => {
  it("managers and the lead archive; copies read take-down; the chart leaves the list, keeps its editions, gets no new ones", async () => {
    const definition = chartDefinitionSchema.parse({
      title: "Chart to archive",
      law: { law: "murray" },
      lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
      stentPlatformId: stentId,
      paper: "A4",
      orientation: "portrait",
      readingDistanceM: 1,
    });
    const archivedChart = (await createChart({ labId: team.lab.id, userId: team.people.educator.id, definition })).id;
    as(team.people.educator);
    const made = await callJson<{ id: string }, { id: number }>(
      createEditionRoute,
      { id: String(archivedChart) },
      "POST",
    );
    await approve(made.json.id);
    const room = await createRoom({
      labId: team.lab.id,
      name: "Room 2",
      actor: { id: team.people.manager.id, name: "M" },
    });
    await recordPosting({
      labId: team.lab.id,
      editionId: made.json.id,
      roomId: (room as { id: number }).id,
      actor: { id: team.people.manager.id, name: "M" },
    });
    expect(await check(made.json.id)).toMatchObject({ status: "current", action: "keep" });

    for (const who of ["educator", "operator"] as const) {
      as(team.people[who]);
      expect((await callJson(archiveRoute, { id: String(archivedChart) }, "POST")).status).toBe(403);
    }
    as(team.people.outsider);
    expect((await callJson(archiveRoute, { id: String(archivedChart) }, "POST")).status).toBe(404);
    as(team.people.lead);
    const bad = await callJson<{ id: string }, { error: { issues: { path: string[] }[] } }>(
      archiveRoute,
      { id: String(archivedChart) },
      "POST",
      { confirm: true },
    );
    expect(bad.status).toBe(400);
    const [still] = await db.select().from(charts).where(eq(charts.id, archivedChart));
    expect(still!.archivedAt).toBeNull();

    const ok = await callJson<{ id: string }, { archivedAt: string }>(
      archiveRoute,
      { id: String(archivedChart) },
      "POST",
    );
    expect(ok.status).toBe(200);
    expect(typeof ok.json.archivedAt).toBe("string");
    as(team.people.manager);
    expect((await callJson(archiveRoute, { id: String(archivedChart) }, "POST")).status).toBe(409);

    expect(await check(made.json.id)).toMatchObject({ status: "withdrawn", action: "take-down", currentEdition: null });
    const [posting] = await db.select().from(postings).where(eq(postings.editionId, made.json.id));
    expect(posting!.lastStatus).toBe("withdrawn");

    as(team.people.operator);
    const listed = await callJson<{ slug: string }, { id: number }[]>(listChartsRoute, { slug: team.lab.slug }, "GET");
    expect(listed.json.map((c) => c.id)).not.toContain(archivedChart);
    expect(listed.json.map((c) => c.id)).toContain(chartId);
    const res = await listChartsRoute(new Request(`${env.APP_URL}/api/v1/labs/${team.lab.slug}/charts?archived=1`), {
      params: Promise.resolve({ slug: team.lab.slug }),
    });
    const archivedList = (await res.json()) as { id: number; archivedAt: string | null }[];
    expect(archivedList.map((c) => c.id)).toEqual([archivedChart]);
    expect(archivedList[0]!.archivedAt).toBe(ok.json.archivedAt);
    expect(await db.select().from(editions).where(eq(editions.chartId, archivedChart))).toHaveLength(1);

    as(team.people.educator);
    expect((await callJson(createEditionRoute, { id: String(archivedChart) }, "POST")).status).toBe(409);

    // Restoring undoes it: the same roles, the copy reads keep again, the chart is listed, it gets editions.
    for (const who of ["educator", "operator"] as const) {
      as(team.people[who]);
      expect((await callJson(restoreRoute, { id: String(archivedChart) }, "POST")).status).toBe(403);
    }
    as(team.people.outsider);
    expect((await callJson(restoreRoute, { id: String(archivedChart) }, "POST")).status).toBe(404);
    as(team.people.manager);
    const restored = await callJson<{ id: string }, { archivedAt: string | null }>(
      restoreRoute,
      { id: String(archivedChart) },
      "POST",
    );
    expect(restored.status).toBe(200);
    expect(restored.json.archivedAt).toBeNull();
    expect((await callJson(restoreRoute, { id: String(archivedChart) }, "POST")).status).toBe(409);
    expect(await check(made.json.id)).toMatchObject({ status: "current", action: "keep" });
    const [back] = await db.select().from(postings).where(eq(postings.editionId, made.json.id));
    expect(back!.lastStatus).toBe("current");
    as(team.people.operator);
    const relisted = await callJson<{ slug: string }, { id: number }[]>(
      listChartsRoute,
      { slug: team.lab.slug },
      "GET",
    );
    expect(relisted.json.map((c) => c.id)).toContain(archivedChart);
    as(team.people.educator);
    expect([200, 201]).toContain((await callJson(createEditionRoute, { id: String(archivedChart) }, "POST")).status);
    // Archived again: a change of its own, so its copies go stale again and a notice is recorded.
    as(team.people.lead);
    expect((await callJson(archiveRoute, { id: String(archivedChart) }, "POST")).status).toBe(200);
    expect(await check(made.json.id)).toMatchObject({ status: "withdrawn", action: "take-down" });
    const archivedNotices = (await notices()).filter((n) => n.changeKey.startsWith(`chart:${archivedChart}:archived:`));
    expect(archivedNotices).toHaveLength(2);
  });
});
