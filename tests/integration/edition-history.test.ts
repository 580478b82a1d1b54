// Each edition keeps the history of what it changed: its diff names the edition it replaced at
// approval, even after that edition was superseded or withdrawn. On MariaDB; only the session is stood in for.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { editions } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session";
import type { EditionDiff } from "@/lib/editions/diff";
import { PATCH as patchChartRoute } from "@/app/api/v1/charts/[id]/route";
import { POST as createEditionRoute } from "@/app/api/v1/charts/[id]/editions/route";
import { POST as approveRoute } from "@/app/api/v1/editions/[id]/approve/route";
import { POST as withdrawRoute } from "@/app/api/v1/editions/[id]/withdraw/route";
import { GET as diffRoute } from "@/app/api/v1/editions/[id]/diff/route";
import { chartEditionHistory } from "@/lib/ops/editions";
import { call } from "../support/routes";
import { labWithSmallChart } from "./support/writes";

const session = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));

let team: Awaited<ReturnType<typeof labWithSmallChart>>["team"];
let chartId = 0;
let familyId = 0;
const as = (who: "manager" | "lead" | "educator" | "operator") => {
  const p = team.people[who];
  session.user = { id: p.id, email: p.email, name: p.name };
};

const newEdition = async (rows: number[]) => {
  as("educator");
  const lookups = [{ kind: "proximal", familyId, rounding: "up", rows, cols: [2.5, 3] }];
  expect((await call(patchChartRoute, { id: String(chartId) }, "PATCH", { lookups })).status).toBe(200);
  const r = await call(createEditionRoute, { id: String(chartId) }, "POST");
  expect(r.status).toBe(201);
  return ((await r.json()) as { id: number }).id;
};
const approve = async (id: number) => {
  as("lead");
  expect((await call(approveRoute, { id: String(id) }, "POST", { reviewed: true })).status).toBe(200);
};
const diff = async (id: number) => {
  as("operator");
  const r = await call(diffRoute, { id: String(id) }, "GET");
  expect(r.status).toBe(200);
  return (await r.json()) as EditionDiff;
};
const status = async (id: number) =>
  (await db.select({ s: editions.status }).from(editions).where(eq(editions.id, id)))[0]?.s;

beforeAll(async () => {
  ({ team, chartId, familyId } = await labWithSmallChart({ name: "History" }));
});

afterAll(() => pool.end());

describe("edition history", () => {
  it("an approved edition's diff stays against the edition it replaced, through supersession and withdrawal", async () => {
    const e1 = await newEdition([3, 3.5]);
    await approve(e1);
    expect((await diff(e1)).against).toBeNull();

    const e2 = await newEdition([3, 3.5, 4]);
    // A draft compares with the chart's approved edition: what approving it would replace.
    expect((await diff(e2)).against).toBe(e1);
    await approve(e2);
    expect(await status(e1)).toBe("superseded");
    const d2 = await diff(e2);
    expect(d2.against).toBe(e1);
    expect(d2.cells.map((c) => [c.row, c.col])).toEqual([
      [4, 2.5],
      [4, 3],
    ]);

    const e3 = await newEdition([3.5, 4]);
    await approve(e3);
    expect(await status(e2)).toBe("superseded");
    // Edition 2 keeps its own history after being replaced, and edition 3 names edition 2.
    expect((await diff(e2)).against).toBe(e1);
    const d3 = await diff(e3);
    expect(d3.against).toBe(e2);
    expect(d3.cells.map((c) => [c.row, c.col, c.before === null, c.after === null])).toEqual([
      [3, 2.5, false, true],
      [3, 3, false, true],
    ]);

    // Withdrawing edition 2 keeps what it replaced and what replaced it; the reason is stored.
    as("manager");
    const w = await call(withdrawRoute, { id: String(e2) }, "POST", { reason: "Printed from a wrong stock list" });
    expect(w.status).toBe(200);
    expect((await diff(e2)).against).toBe(e1);
    expect((await diff(e3)).against).toBe(e2);
    const [row] = await db
      .select({ reason: editions.withdrawalReason, replaces: editions.replacesId })
      .from(editions)
      .where(and(eq(editions.id, e2), eq(editions.labId, team.lab.id)));
    expect(row).toEqual({ reason: "Printed from a wrong stock list", replaces: e1 });
  });

  it("the chart's history lists each edition with its people and what it changed against its predecessor", async () => {
    const p = team.people.operator;
    const lines = await chartEditionHistory(
      { kind: "user", user: { id: p.id, email: p.email, name: p.name } },
      {
        chartId: String(chartId),
      },
    );
    expect(lines.map((l) => [l.number, l.status, l.againstNumber, l.changedCells])).toEqual([
      [3, "approved", 2, 2],
      [2, "withdrawn", 1, 2],
      [1, "superseded", null, 4],
    ]);
    expect(lines[0]).toMatchObject({
      createdByName: team.people.educator.name,
      approvedByName: team.people.lead.name,
      changedItems: ["Rounding: POT balloon (parent) from main branch × side branch"],
    });
  });

  it("the database keeps an approved edition's predecessor with its approval", async () => {
    const [approved] = await db
      .select({ id: editions.id })
      .from(editions)
      .where(and(eq(editions.chartId, chartId), eq(editions.status, "approved")));
    // Even a legal move (approved -> superseded) cannot rewrite it on the way.
    await expect(
      db.update(editions).set({ status: "superseded", replacesId: null }).where(eq(editions.id, approved!.id)),
    ).rejects.toMatchObject({ cause: { sqlMessage: "an approved edition keeps its approval" } });
    const [kept] = await db.select({ r: editions.replacesId }).from(editions).where(eq(editions.id, approved!.id));
    expect(kept!.r).not.toBeNull();
  });
});
