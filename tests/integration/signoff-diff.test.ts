// The edition diff as a client reads it on MariaDB: what an approver compares before signing.
// Only the session (who is calling) is stood in for.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { balloonFamilies, editions, labRules } from "@/db/schema";
import type { EditionDiff } from "@/lib/editions/diff";
import { GET as diffRoute } from "@/app/api/v1/editions/[id]/diff/route";
import { PUT as putRules } from "@/app/api/v1/labs/[slug]/rules/route";
import { signOffQueue } from "@/lib/ops/editions";
import { labWithSmallChart } from "./support/writes";
import { as, type Member } from "../support/roles";
import { callJson } from "../support/routes";
import { signOffSteps } from "./support/sign-off";

vi.mock("@/lib/auth/session", () => import("../support/session"));

let team: Awaited<ReturnType<typeof labWithSmallChart>>["team"];
let chartId = 0;

const { newEdition, approve, patch } = signOffSteps(
  () => team.people,
  () => chartId,
);
const diff = async (id: number, who: Member = "lead") => {
  as(team.people[who]);
  return callJson<{ id: string }, EditionDiff>(diffRoute, { id: String(id) }, "GET");
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
  it("lists waiting drafts oldest first, for the lead; managers only once the rules grant approval", async () => {
    const queue = await signOffQueue(as(team.people.lead), { lab: team.lab.slug });
    const drafts = await db.select().from(editions).where(eq(editions.labId, team.lab.id));
    const waiting = drafts
      .filter((e) => e.status === "draft")
      .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || a.id - b.id);
    expect(queue.map((d) => d.id)).toEqual(waiting.map((e) => e.id));
    expect(queue.length).toBeGreaterThan(1);
    expect(queue[0]).toMatchObject({ chartTitle: "Diff chart", createdByName: team.people.educator.name });

    for (const who of ["manager", "educator", "operator"] as const)
      await expect(signOffQueue(as(team.people[who]), { lab: team.lab.slug })).rejects.toMatchObject({ status: 403 });
    await expect(signOffQueue(as(team.people.outsider), { lab: team.lab.slug })).rejects.toMatchObject({ status: 404 });

    as(team.people.lead);
    expect((await callJson(putRules, { slug: team.lab.slug }, "PUT", { managersMayApprove: true })).status).toBe(200);
    expect((await signOffQueue(as(team.people.manager), { lab: team.lab.slug })).map((d) => d.id)).toEqual(
      queue.map((d) => d.id),
    );
    await db.delete(labRules).where(eq(labRules.labId, team.lab.id));
  });
});
