// The edition diff as a client reads it on MariaDB: what an approver compares before signing.
// Only the session (who is calling) is stood in for.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, editions, labRules } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session";
import { env } from "@/lib/env";
import type { EditionDiff } from "@/lib/editions/diff";
import { PATCH as patchChartRoute } from "@/app/api/v1/charts/[id]/route";
import { POST as createEditionRoute } from "@/app/api/v1/charts/[id]/editions/route";
import { POST as approveRoute } from "@/app/api/v1/editions/[id]/approve/route";
import { GET as diffRoute } from "@/app/api/v1/editions/[id]/diff/route";
import { PUT as putRules } from "@/app/api/v1/labs/[slug]/rules/route";
import { signOffQueue } from "@/lib/ops/editions";
import type { Caller } from "@/lib/ops/caller";
import { labWithSmallChart } from "./support/writes";

const session = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));

let team: Awaited<ReturnType<typeof labWithSmallChart>>["team"];
let chartId = 0;
type Who = "manager" | "lead" | "educator" | "operator" | "outsider";
const as = (who: Who) => {
  const p = team.people[who];
  session.user = { id: p.id, email: p.email, name: p.name };
};

type Handler<P> = (req: Request, ctx: { params: Promise<P> }) => Promise<Response>;
async function call<P, T = Record<string, unknown>>(handler: Handler<P>, params: P, method: string, body?: unknown) {
  const headers: Record<string, string> = { origin: new URL(env.APP_URL).origin };
  if (body !== undefined) headers["content-type"] = "application/json";
  const res = await handler(
    new Request(`${env.APP_URL}/api/v1/x`, {
      method,
      headers,
      ...(body === undefined ? {} : { body: JSON.stringify(body) }),
    }),
    { params: Promise.resolve(params) },
  );
  return { status: res.status, json: (await res.json()) as T };
}

const newEdition = async () => {
  as("educator");
  const r = await call<{ id: string }, { id: number }>(createEditionRoute, { id: String(chartId) }, "POST");
  expect([200, 201]).toContain(r.status);
  return r.json.id;
};
const approve = async (id: number) => {
  as("lead");
  expect((await call(approveRoute, { id: String(id) }, "POST", { reviewed: true })).status).toBe(200);
};
const diff = async (id: number, who: Who = "lead") => {
  as(who);
  return call<{ id: string }, EditionDiff>(diffRoute, { id: String(id) }, "GET");
};
const patch = async (body: unknown) => {
  as("educator");
  expect((await call(patchChartRoute, { id: String(chartId) }, "PATCH", body)).status).toBe(200);
};

beforeAll(async () => {
  ({ team, chartId } = await labWithSmallChart({ name: "Diff" }));
});

afterAll(() => pool.end());

describe("GET /api/v1/editions/:id/diff", () => {
  it("with nothing approved: against null and every printed cell with before null", async () => {
    const first = await newEdition();
    const d = await diff(first, "operator");
    expect(d.status).toBe(200);
    expect(Object.keys(d.json).sort()).toEqual(["against", "cells"]);
    expect(d.json.against).toBeNull();
    expect(d.json.cells).toHaveLength(4);
    for (const c of d.json.cells) {
      expect(Object.keys(c).sort()).toEqual(["after", "before", "col", "lookup", "row"]);
      expect(c.before).toBeNull();
      expect(c.after).toMatchObject({ printed: expect.any(String), marks: expect.any(Array) });
    }
    expect(d.json.cells.map((c) => [c.lookup, c.row, c.col])).toEqual([
      ["proximal", 3, 2.5],
      ["proximal", 3, 3],
      ["proximal", 3.5, 2.5],
      ["proximal", 3.5, 3],
    ]);
    await approve(first);
  });

  it("against the approved edition: only the new row's cells when an axis grows, nothing for a notes change", async () => {
    const [fam] = await db
      .select({ id: balloonFamilies.id })
      .from(balloonFamilies)
      .where(eq(balloonFamilies.labId, team.lab.id));
    const lookup = { kind: "proximal", familyId: fam!.id, rounding: "up", cols: [2.5, 3] };
    await patch({ lookups: [{ ...lookup, rows: [3, 3.5, 4] }] });
    const grown = await newEdition();
    const approvedId = (await diff(grown)).json.against;
    expect(approvedId).toBeGreaterThan(0);
    const d = (await diff(grown)).json;
    expect(d.cells.map((c) => [c.row, c.col])).toEqual([
      [4, 2.5],
      [4, 3],
    ]);
    expect(d.cells.every((c) => c.before === null && c.after !== null)).toBe(true);
    await approve(grown);

    await patch({ notes: "Only the words change" });
    const reworded = await newEdition();
    expect((await diff(reworded)).json).toEqual({ against: grown, cells: [] });

    // A law change moves the exact diameter printed in every cell.
    await patch({ law: { law: "square" }, lookups: [{ ...lookup, rows: [3, 3.5, 4] }] });
    const squared = await newEdition();
    const sq = (await diff(squared)).json;
    expect(sq.cells).toHaveLength(6);
    for (const c of sq.cells) expect(c.before!.exact).not.toBe(c.after!.exact);
  });

  it("members of another lab get 404, like a missing edition", async () => {
    const first = await newEdition();
    expect((await diff(first, "outsider")).status).toBe(404);
    expect((await diff(999999999, "lead")).status).toBe(404);
  });
});

describe("the approvers' queue", () => {
  const caller = (who: Who): Caller => {
    const p = team.people[who];
    return { kind: "user", user: { id: p.id, email: p.email, name: p.name } };
  };

  it("lists waiting drafts oldest first, for the lead; managers only once the rules grant approval", async () => {
    const queue = await signOffQueue(caller("lead"), { lab: team.lab.slug });
    const drafts = await db.select().from(editions).where(eq(editions.labId, team.lab.id));
    const waiting = drafts
      .filter((e) => e.status === "draft")
      .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || a.id - b.id);
    expect(queue.map((d) => d.id)).toEqual(waiting.map((e) => e.id));
    expect(queue.length).toBeGreaterThan(1);
    expect(queue[0]).toMatchObject({ chartTitle: "Diff chart", createdByName: team.people.educator.name });

    for (const who of ["manager", "educator", "operator"] as const)
      await expect(signOffQueue(caller(who), { lab: team.lab.slug })).rejects.toMatchObject({ status: 403 });
    await expect(signOffQueue(caller("outsider"), { lab: team.lab.slug })).rejects.toMatchObject({ status: 404 });

    as("lead");
    expect((await call(putRules, { slug: team.lab.slug }, "PUT", { managersMayApprove: true })).status).toBe(200);
    expect((await signOffQueue(caller("manager"), { lab: team.lab.slug })).map((d) => d.id)).toEqual(
      queue.map((d) => d.id),
    );
    await db.delete(labRules).where(eq(labRules.labId, team.lab.id));
  });
});
