// The poster PDF route and its variants as a client calls them, on the real MariaDB: the query
// parameters (400 naming the one that is wrong), the NOT CURRENT band on an edition that is no
// longer current, the managers-only archive copy (audited), tiles and the badge card, each
// cached under its own render key; and the legibility gate on approval.
import { execFileSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, balloonFamilies, balloons } from "@/db/schema";
import { formatDate } from "@/lib/format/dates";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { PATCH as patchChartRoute } from "@/app/api/v1/charts/[id]/route";
import { POST as createEditionRoute } from "@/app/api/v1/charts/[id]/editions/route";
import { POST as approveRoute } from "@/app/api/v1/editions/[id]/approve/route";
import { GET as pdfRoute } from "@/app/api/v1/editions/[id]/pdf/route";
import { withTempDir } from "@/tests/support/pdf-tools";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { call } from "../support/routes";
import { createChart } from "./support/writes";
import { as } from "../support/roles";
import { signOffSteps } from "./support/sign-off";

vi.mock("@/lib/auth/session", () => import("../support/session"));

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

let team: Awaited<ReturnType<typeof labWithTeam>>;
let familyId = 0;

const json = async (res: Response) =>
  (await res.json()) as { id: number; error: { message: string; issues?: { path: string[]; message: string }[] } };

async function pdf(editionId: number, query = "") {
  const res = await call(pdfRoute, { id: String(editionId) }, "GET", undefined, query);
  return { res, bytes: Buffer.from(await res.arrayBuffer()) };
}

function pdfPages(bytes: Buffer): { texts: string[]; sizes: { w: number; h: number }[] } {
  return withTempDir((dir) => {
    const file = path.join(dir, "x.pdf");
    writeFileSync(file, bytes);
    const texts = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" }).split("\f").slice(0, -1);
    const info = execFileSync("pdfinfo", ["-f", "1", "-l", "9999", file], { encoding: "utf8" });
    const sizes = [...info.matchAll(/^Page\s+\d+ size:\s+([\d.]+) x ([\d.]+) pts/gm)].map((m) => ({
      w: Number(m[1]),
      h: Number(m[2]),
    }));
    return { texts, sizes };
  });
}

const { approvedEdition } = signOffSteps(
  () => team.people,
  () => 0,
);

const definition = (over: Record<string, unknown> = {}) =>
  chartDefinitionSchema.parse({
    title: "Variant chart",
    law: { law: "murray" },
    lookups: [{ kind: "proximal", familyId, rounding: "up", rows: [3, 3.5], cols: [2.5, 3] }],
    stentPlatformId: stentId,
    paper: "A3",
    orientation: "portrait",
    readingDistanceM: 1.8, // with the stent platform's words the A3 square-law poster is legible to 1.9 m
    ...over,
  });

let chartId = 0;
let first = 0;

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC variants", compliance: "nc", nominalAtm: 10, rbpAtm: 18, growthAtRbpMm: 0 })
    .$returningId();
  familyId = fam!.id;
  await db
    .insert(balloons)
    .values([2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25].map((d) => ({ labId: team.lab.id, familyId, diameterMm: d })));
  chartId = (await createChart({ labId: team.lab.id, userId: team.people.educator.id, definition: definition() })).id;
  first = await approvedEdition(chartId);
});

afterAll(() => pool.end());

describe("GET /api/v1/editions/:id/pdf variants", () => {
  it("answers 400 naming the parameter for values it does not list, and renders nothing", async () => {
    as(team.people.operator);
    for (const [query, name] of [
      ["?tiles=B5", "tiles"],
      ["?tiles=a4", "tiles"],
      ["?format=zip", "format"],
      ["?copy=original", "copy"],
      ["?tiles=A4&format=card", "tiles"],
      ["?size=A4", "size"],
    ] as const) {
      const res = await call(pdfRoute, { id: String(first) }, "GET", undefined, query);
      expect(res.status, query).toBe(400);
      const body = (await res.json()) as { error: { message: string; issues: { path: string[] }[] } };
      expect(body.error.issues.map((i) => i.path.join(".")).concat(body.error.message), query).toEqual(
        expect.arrayContaining([expect.stringContaining(name)]),
      );
    }
  });

  it("the current edition prints no band; each variant is cached under its own key", async () => {
    as(team.people.operator);
    const a = await pdf(first);
    expect(a.res.status).toBe(200);
    expect(a.res.headers.get("x-poster-band")).toBeNull();
    expect(pdfPages(a.bytes).texts[0]).not.toContain("NOT CURRENT");
    expect((await pdf(first)).res.headers.get("x-render-cache")).toBe("hit");
    const card = await pdf(first, "?format=card");
    expect(card.res.headers.get("x-render-cache")).toBe("miss");
    const { sizes, texts } = pdfPages(card.bytes);
    expect(sizes).toHaveLength(2);
    expect(sizes[0]!.w).toBeCloseTo((85.6 * 72) / 25.4, 1);
    expect(sizes[0]!.h).toBeCloseTo((53.98 * 72) / 25.4, 1);
    expect(texts[0]).toMatch(/[0-9A-Z]{4}-[0-9A-Z]{4}/);
    const tiles = await pdf(first, "?tiles=A4");
    expect(tiles.res.headers.get("x-render-cache")).toBe("miss");
    expect(tiles.res.headers.get("content-disposition")).toContain("-tiles-A4.pdf");
    const t = pdfPages(tiles.bytes);
    expect(t.texts[0]).toContain("Assembly map");
    expect(t.sizes.length).toBeGreaterThan(2);
    expect((await pdf(first, "?tiles=A4")).res.headers.get("x-render-cache")).toBe("hit");
  });

  it("a superseded edition carries NOT CURRENT - DO NOT POST with today's date on every page, in every variant", async () => {
    as(team.people.manager);
    // A clinical change (the law): a notes-only edition would leave the first copy current.
    expect((await call(patchChartRoute, { id: String(chartId) }, "PATCH", { law: { law: "square" } })).status).toBe(
      200,
    );
    await approvedEdition(chartId);
    as(team.people.operator);
    const today = formatDate(new Date(), "UTC");
    for (const query of ["", "?tiles=A3", "?format=card"]) {
      const { res, bytes } = await pdf(first, query);
      expect(res.status, query).toBe(200);
      expect(res.headers.get("x-poster-band"), query).toBe("not-current");
      expect(res.headers.get("content-disposition"), query).toContain("NOT-CURRENT");
      for (const text of pdfPages(bytes).texts) expect(text, query).toContain(`NOT CURRENT - DO NOT POST ${today}`);
    }
  });

  it("the archive copy is for managers only, stamped ARCHIVE COPY, and audited", async () => {
    for (const role of ["operator", "educator", "lead"] as const) {
      as(team.people[role]);
      expect((await pdf(first, "?copy=archive")).res.status, role).toBe(403);
    }
    as(team.people.manager);
    const { res, bytes } = await pdf(first, "?copy=archive");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toContain("ARCHIVE-COPY");
    const [text] = pdfPages(bytes).texts;
    expect(text).toContain("ARCHIVE COPY");
    expect(text).not.toContain("NOT CURRENT");
    // The poster as approved: no superseded banner of its own.
    expect(text).not.toContain("SUPERSEDED");
    const rows = await db
      .select({ action: auditEvents.action })
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, team.lab.id), eq(auditEvents.targetId, String(first))));
    expect(rows.map((r) => r.action)).toContain("edition.archive_copy");
  });

  it("a draft carries DRAFT - NOT FOR CLINICAL USE on every page, in every variant", async () => {
    as(team.people.educator);
    expect((await call(patchChartRoute, { id: String(chartId) }, "PATCH", { notes: "Draft stamp" })).status).toBe(200);
    const created = await json(await call(createEditionRoute, { id: String(chartId) }, "POST"));
    as(team.people.operator);
    for (const query of ["", "?tiles=A4", "?format=card"]) {
      const { res, bytes } = await pdf(created.id, query);
      expect(res.status, query).toBe(200);
      expect(res.headers.get("x-poster-band"), query).toBe("unapproved");
      expect(res.headers.get("content-disposition"), query).toContain("-DRAFT");
      for (const text of pdfPages(bytes).texts) expect(text, query).toContain("DRAFT - NOT FOR CLINICAL USE");
    }
  });
});

describe("the legibility gate on approval", () => {
  it("refuses a poster too small to read at its distance with 409 naming the rule", async () => {
    const small = (
      await createChart({
        labId: team.lab.id,
        userId: team.people.educator.id,
        definition: definition({
          title: "Too small",
          paper: "A4",
          readingDistanceM: 3,
          lookups: [
            {
              kind: "proximal",
              familyId,
              rounding: "up",
              rows: { from: 2.5, to: 4.5, step: 0.25 },
              cols: { from: 2, to: 4, step: 0.25 },
            },
          ],
        }),
      })
    ).id;
    as(team.people.educator);
    const created = await json(await call(createEditionRoute, { id: String(small) }, "POST"));
    as(team.people.lead);
    const res = await call(approveRoute, { id: String(created.id) }, "POST", { reviewed: true });
    expect(res.status).toBe(409);
    const body = await json(res);
    expect(body.error.message).toContain('Lab rule "legibility"');
    expect(body.error.issues?.[0]?.message).toBe("legibility");
  });
});
