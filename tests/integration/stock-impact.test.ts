// The impact preview (POST /api/v1/labs/:slug/stock/impact) and the combined balloon and stent
// import, through the route handlers on the real MariaDB: the preview names the copies a change
// would outdate and writes nothing at all; the import adds stents beside balloons.
import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { POST as impactRoute } from "@/app/api/v1/labs/[slug]/stock/impact/route";
import { POST as importRoute } from "@/app/api/v1/labs/[slug]/stock/import/route";
import { auditEvents, balloons, labRules, labs, postings, staleNotices, stentPlatforms, stentSizes } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { labRulesImpact } from "@/lib/ops/lab-rules";
import type { Caller } from "@/lib/ops/caller";
import { approveEdition, createEdition, createRoom, labWithSmallChart, recordPosting } from "./support/writes";

const session = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));

type Setup = Awaited<ReturnType<typeof labWithSmallChart>>;
let s: Setup;
let editionId = 0;
const diameters = [2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25, 4.5];
const balloonAt = (d: number) => s.balloonIds[diameters.indexOf(d)]!;
type Who = "manager" | "lead" | "educator" | "operator" | "outsider";
const as = (who: Who) => {
  const p = s.team.people[who];
  session.user = { id: p.id, email: p.email, name: p.name };
};

async function impact(body: unknown, slug = s.team.lab.slug) {
  const res = await impactRoute(
    new Request(`${env.APP_URL}/api/v1/labs/${slug}/stock/impact`, {
      method: "POST",
      headers: { origin: new URL(env.APP_URL).origin, "content-type": "application/json" },
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve({ slug }) },
  );
  return { status: res.status, json: (await res.json()) as Record<string, unknown> };
}

async function importCsv(csv: string, query = "") {
  const body = new FormData();
  body.set("file", new File([csv], "stock.csv", { type: "text/csv" }));
  const res = await importRoute(
    new Request(`${env.APP_URL}/api/v1/labs/${s.team.lab.slug}/stock/import${query}`, {
      method: "POST",
      headers: { origin: new URL(env.APP_URL).origin },
      body,
    }),
    { params: Promise.resolve({ slug: s.team.lab.slug }) },
  );
  return {
    status: res.status,
    json: (await res.json()) as Record<string, unknown> & { plan: Record<string, unknown[]> },
  };
}

/** Everything a preview must leave as it was: revision, stock rows, postings' statuses, notices, audit rows. */
async function labState() {
  const labId = s.team.lab.id;
  const [lab] = await db.select({ rev: labs.stockRevision }).from(labs).where(eq(labs.id, labId));
  const n = async (table: typeof auditEvents | typeof staleNotices | typeof stentSizes) =>
    (await db.select({ n: count() }).from(table).where(eq(table.labId, labId)))[0]!.n;
  return {
    rev: lab!.rev,
    balloons: await db.select().from(balloons).where(eq(balloons.labId, labId)),
    postings: await db
      .select({ id: postings.id, last: postings.lastStatus })
      .from(postings)
      .where(eq(postings.labId, labId)),
    rules: await db.select().from(labRules).where(eq(labRules.labId, labId)),
    audits: await n(auditEvents),
    notices: await n(staleNotices),
    stentSizes: await n(stentSizes),
  };
}

beforeAll(async () => {
  s = await labWithSmallChart({ name: `Impact ${Date.now().toString(36)}`, diameters });
  const labId = s.team.lab.id;
  const ed = await createEdition({ labId, chartId: s.chartId, actor: s.team.people.educator });
  await approveEdition({ labId, editionId: ed.id, actor: s.team.people.lead });
  editionId = ed.id;
  for (const name of ["Room 2", "Room 1"]) {
    const room = await createRoom({ labId, name, actor: s.team.people.manager });
    await recordPosting({ labId, editionId, roomId: room.id, actor: s.team.people.manager });
  }
});

afterAll(() => pool.end());

describe("POST /api/v1/labs/:slug/stock/impact", () => {
  it("names the chart, edition, copies and rooms a size going out of stock would outdate, and writes nothing", async () => {
    as("manager");
    const before = await labState();
    expect(before.postings.map((p) => p.last)).toEqual(["current", "current"]);
    // Murray POT of 3.5 and 3 mm is 4.12 mm, rounded up to the 4.25 mm balloon.
    const res = await impact({ balloons: [{ id: balloonAt(4.25), inStock: false }] });
    expect(res.status).toBe(200);
    expect(res.json).toEqual({
      outdates: [{ chartId: s.chartId, title: expect.any(String), editionId, copies: 2, rooms: ["Room 1", "Room 2"] }],
    });
    expect(await labState()).toEqual(before);
  });

  it("answers no outdates for a size no cell can reach, and for a CSV that changes nothing printed", async () => {
    as("manager");
    expect((await impact({ balloons: [{ id: balloonAt(2.5), inStock: false }] })).json).toEqual({ outdates: [] });
    const family = (await db.query.balloonFamilies.findFirst({ where: (f, { eq }) => eq(f.id, s.familyId) }))!.name;
    const same = ["family,compliance,diameter_mm,in_stock", ...diameters.map((d) => `${family},nc,${d},yes`)];
    expect((await impact({ csv: same.join("\n") })).json).toEqual({ outdates: [] });
    const before = await labState();
    const without = same.filter((l) => !l.includes(",4.25,"));
    const res = await impact({ csv: without.join("\n") });
    expect(res.json).toMatchObject({ outdates: [{ editionId, copies: 2 }] });
    expect(await labState()).toEqual(before);
  });

  it("refuses bad input with 400 naming the field, other roles with 403, another lab's manager with 404", async () => {
    as("manager");
    const before = await labState();
    const bad = await impact({ balloons: [{ id: balloonAt(3), inStock: "maybe" }] });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.json)).toContain('"path":["balloons",0,"inStock"]');
    expect((await impact({})).status).toBe(400);
    expect((await impact({ csv: "family,compliance,diameter_mm,in_stock\nX,nc,2.5,perhaps" })).status).toBe(400);
    expect((await impact({ balloons: [{ id: 999999999, inStock: false }] })).status).toBe(404);
    for (const who of ["lead", "educator", "operator"] as const) {
      as(who);
      expect((await impact({ balloons: [{ id: balloonAt(4.25), inStock: false }] })).status).toBe(403);
    }
    as("outsider");
    expect((await impact({ balloons: [{ id: balloonAt(4.25), inStock: false }] })).status).toBe(404);
    expect(await labState()).toEqual(before);
  });

  it("previews a change to the lab's rules for the medical lead without saving it", async () => {
    const before = await labState();
    const lead = s.team.people.lead;
    const caller: Caller = { kind: "user", user: { id: lead.id, email: lead.email, name: lead.name } };
    const res = await labRulesImpact(caller, { lab: s.team.lab.slug }, { reviewPeriodMonths: 6 });
    expect(res).toEqual({ outdates: [] });
    expect(await labState()).toEqual(before);
  });
});

describe("one CSV for balloons and stents", () => {
  const csv = [
    "family,platform,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm,max_post_dilatation_mm",
    "SC import family (illustrative),,sc,2.50,yes,8,14,",
    ",Import platform (illustrative),,3.00,,,,4.50",
    ",Import platform (illustrative),,3.50,,,,4.75",
  ].join("\n");

  it("previews, then applies both kinds as one change with one audit row", async () => {
    as("manager");
    const before = await labState();
    const preview = await importCsv(csv, "?dryRun=1");
    expect(preview.status).toBe(200);
    expect(preview.json.summary).toBe("1 family added, 1 size added, 1 stent platform added, 2 stent sizes added");
    expect(await labState()).toEqual(before);

    const applied = await importCsv(csv, `?revision=${String(preview.json.revision)}`);
    expect(applied.status).toBe(200);
    expect(applied.json.applied).toBe(true);
    const [platform] = await db
      .select()
      .from(stentPlatforms)
      .where(and(eq(stentPlatforms.labId, s.team.lab.id), eq(stentPlatforms.name, "Import platform (illustrative)")));
    const sizes = await db.select().from(stentSizes).where(eq(stentSizes.platformId, platform!.id));
    expect(sizes.map((z) => [z.nominalMm, z.maxPostDilatationMm]).sort()).toEqual([
      [3, 4.5],
      [3.5, 4.75],
    ]);
    const after = await labState();
    expect(after.rev).toBe(before.rev + 1);
    expect(after.audits).toBe(before.audits + 1);
  });

  it("refuses the whole file when one stent line is bad, and changes nothing", async () => {
    as("manager");
    const before = await labState();
    const bad = await importCsv(`${csv}\n,Import platform (illustrative),,4.00,,,,3.50`);
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.json)).toContain('"path":["line",5,"max_post_dilatation_mm"]');
    expect(await labState()).toEqual(before);
  });
});
