// The sign-off, rules and check routes as a client calls them: status codes, error bodies naming
// the field, and the check's action. Only the session (who is calling) is stood in for.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { editions, labRules } from "@/db/schema";
import { PATCH as patchChartRoute } from "@/app/api/v1/charts/[id]/route";
import { POST as createEditionRoute } from "@/app/api/v1/charts/[id]/editions/route";
import { POST as approveRoute } from "@/app/api/v1/editions/[id]/approve/route";
import { POST as rejectRoute } from "@/app/api/v1/editions/[id]/reject/route";
import { POST as withdrawRoute } from "@/app/api/v1/editions/[id]/withdraw/route";
import { GET as getRules, PUT as putRules } from "@/app/api/v1/labs/[slug]/rules/route";
import { GET as checkRoute } from "@/app/api/v1/check/[token]/route";
import { labWithSmallChart } from "./support/writes";
import { as } from "../support/roles";
import { callJson } from "../support/routes";

vi.mock("@/lib/auth/session", () => import("../support/session"));

let team: Awaited<ReturnType<typeof labWithSmallChart>>["team"];
let chartId = 0;

beforeAll(async () => {
  ({ team, chartId } = await labWithSmallChart({ name: "Route", diameters: [2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25] }));
});

afterAll(() => pool.end());

describe("sign-off routes", () => {
  it("create edition: 201 for a new draft, 200 with the same id for the identical one", async () => {
    as(team.people.educator);
    const first = await callJson(createEditionRoute, { id: String(chartId) }, "POST");
    expect(first.status).toBe(201);
    const again = await callJson(createEditionRoute, { id: String(chartId) }, "POST");
    expect(again.status).toBe(200);
    expect(again.json.id).toBe(first.json.id);
  });

  it("approve: 400 naming reviewed, 403 for a manager, 200 for the lead; then the check says keep", async () => {
    as(team.people.educator);
    const { json: ed } = await callJson(createEditionRoute, { id: String(chartId) }, "POST");
    as(team.people.lead);
    const missing = await callJson(approveRoute, { id: String(ed.id) }, "POST");
    expect(missing.status).toBe(400);
    expect(missing.json.error.issues.map((i) => i.path.join("."))).toContain("reviewed");
    as(team.people.manager);
    expect((await callJson(approveRoute, { id: String(ed.id) }, "POST", { reviewed: true })).status).toBe(403);
    as(team.people.lead);
    const ok = await callJson(approveRoute, { id: String(ed.id) }, "POST", { reviewed: true });
    expect(ok.status).toBe(200);
    expect(ok.json).toMatchObject({ status: "approved" });
    expect(typeof ok.json.reviewBy).toBe("string");
    const [row] = await db.select().from(editions).where(eq(editions.id, ed.id!));
    as(null);
    const check = await callJson(checkRoute, { token: row!.checkToken }, "GET");
    expect(check.status).toBe(200);
    expect(check.json).toMatchObject({ status: "current", action: "keep", reviewBy: ok.json.reviewBy });

    // Withdrawn without a reason: 400; with one: the copy reads take-down.
    as(team.people.manager);
    const noReason = await callJson(withdrawRoute, { id: String(ed.id) }, "POST", {});
    expect(noReason.status).toBe(400);
    expect(JSON.stringify(noReason.json.error.issues)).toMatch(/reason/);
    expect((await callJson(withdrawRoute, { id: String(ed.id) }, "POST", { reason: "Wrong law" })).status).toBe(200);
    as(null);
    expect((await callJson(checkRoute, { token: row!.checkToken }, "GET")).json).toMatchObject({
      status: "withdrawn",
      action: "take-down",
    });
  });

  it("four eyes over HTTP: a manager granted approval who edits the chart cannot approve its next edition", async () => {
    // The attack: a manager rewrites the chart and has an educator press "Create edition".
    as(team.people.lead);
    const granted = await callJson(putRules, { slug: team.lab.slug }, "PUT", { managersMayApprove: true });
    expect(granted.status).toBe(200);
    as(team.people.manager);
    const edited = await callJson(patchChartRoute, { id: String(chartId) }, "PATCH", { notes: "Manager's own words" });
    expect(edited.status).toBe(200);
    as(team.people.educator);
    const created = await callJson(createEditionRoute, { id: String(chartId) }, "POST", {});
    expect(created.status).toBe(201);
    const before = await db.select().from(editions).where(eq(editions.id, created.json.id!));
    as(team.people.manager);
    expect((await callJson(approveRoute, { id: String(created.json.id) }, "POST", { reviewed: true })).status).toBe(
      403,
    );
    expect(await db.select().from(editions).where(eq(editions.id, created.json.id!))).toEqual(before);
    as(team.people.lead);
    expect((await callJson(approveRoute, { id: String(created.json.id) }, "POST", { reviewed: true })).status).toBe(
      200,
    );
    // Leave the lab as the other tests expect it: no rules recorded.
    await db.delete(labRules).where(eq(labRules.labId, team.lab.id));
  });

  it("send back: returned with the reason, then approving it is 409", async () => {
    as(team.people.educator);
    const { json: ed } = await callJson(createEditionRoute, { id: String(chartId) }, "POST");
    as(team.people.lead);
    const back = await callJson(rejectRoute, { id: String(ed.id) }, "POST", { reason: "Columns too narrow" });
    expect(back).toMatchObject({ status: 200, json: { status: "returned", rejectionReason: "Columns too narrow" } });
    expect((await callJson(approveRoute, { id: String(ed.id) }, "POST", { reviewed: true })).status).toBe(409);
  });
});

describe("lab rules routes", () => {
  it("GET for members; PUT 403 for others, 400 for unknown keys, 200 for the lead", async () => {
    as(team.people.operator);
    const read = await callJson(getRules, { slug: team.lab.slug }, "GET");
    expect(read).toMatchObject({ status: 200, json: { reviewPeriodMonths: 12, managersMayApprove: false } });
    for (const role of ["manager", "educator", "operator"] as const) {
      as(team.people[role]);
      expect((await callJson(putRules, { slug: team.lab.slug }, "PUT", { managersMayApprove: true })).status).toBe(403);
    }
    as(team.people.lead);
    const unknown = await callJson(putRules, { slug: team.lab.slug }, "PUT", {
      managersMayApprove: true,
      approvers: 1,
    });
    expect(unknown.status).toBe(400);
    expect(JSON.stringify(unknown.json.error.issues)).toMatch(/approvers/);
    expect(await db.select().from(labRules).where(eq(labRules.labId, team.lab.id))).toEqual([]);
    const ok = await callJson(putRules, { slug: team.lab.slug }, "PUT", { reviewPeriodMonths: 24 });
    expect(ok).toMatchObject({ status: 200, json: { rules: { reviewPeriodMonths: 24, managersMayApprove: false } } });
  });

  it("PUT per lookup kind: 400 naming nested fields and missing reasons, 409 for a stale revision; approval of a chart outside them is 422 naming the rule", async () => {
    as(team.people.lead);
    const { json: read } = await callJson(getRules, { slug: team.lab.slug }, "GET");
    const revision = read.revision as number;
    for (const [body, path] of [
      [{ lookups: { proximal: { laws: ["murray", "murray"] } } }, ["lookups", "proximal", "laws"]],
      [{ lookups: { proximal: { caps: { upMm: 0.25 } } } }, ["lookups", "proximal", "caps", "downMm"]],
      [{ exceptions: [{ chartId, rule: "law" }] }, ["exceptions", 0, "reason"]],
      [{ exceptions: [{ chartId, rule: "law", reason: "ok", note: 1 }] }, ["exceptions", 0]],
    ] as const) {
      const res = await callJson(putRules, { slug: team.lab.slug }, "PUT", body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(
        res.json.error.issues.map((i) => JSON.stringify(i.path)),
        JSON.stringify(body),
      ).toContain(JSON.stringify(path));
    }
    const stale = await callJson(putRules, { slug: team.lab.slug }, "PUT", {
      revision: revision + 5,
      reviewPeriodMonths: 6,
    });
    expect(stale.status).toBe(409);
    expect(JSON.stringify(stale.json.error.issues)).toContain("revision");
    const narrowed = await callJson(putRules, { slug: team.lab.slug }, "PUT", {
      revision,
      lookups: { proximal: { laws: ["murray"] } },
    });
    // The default law (Finet) would no longer be allowed.
    expect(narrowed.status).toBe(400);
    expect(JSON.stringify(narrowed.json.error.issues)).toContain("defaultLaw");
    const ok = await callJson(putRules, { slug: team.lab.slug }, "PUT", {
      revision,
      lookups: { proximal: { laws: ["finet", "huo-kassab"], defaultLaw: { law: "huo-kassab" } } },
    });
    expect(ok).toMatchObject({ status: 200, json: { revision: revision + 1, changed: ["lookups"] } });

    as(team.people.educator);
    const { json: ed } = await callJson(createEditionRoute, { id: String(chartId) }, "POST");
    as(team.people.lead);
    const refused = await callJson(approveRoute, { id: String(ed.id) }, "POST", { reviewed: true });
    expect(refused.status).toBe(422);
    expect(String((refused.json.error as unknown as { message: string }).message)).toMatch(/laws allowed.*not Murray/);
    // Leave the lab as the other tests expect it: no rules recorded.
    await db.delete(labRules).where(eq(labRules.labId, team.lab.id));
  });
});
