// Four eyes through every door: whoever changed what a draft prints since the chart's last
// approval (the chart, the stock by hand or by their token, an exception in the lab rules) may
// not approve it, and the refusal names what they changed; a change that does not reach what
// the chart prints does not count.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { balloons, charts, editions } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { Caller } from "@/lib/ops/caller";
import { approveEdition } from "@/lib/ops/editions";
import { setLabRules } from "@/lib/ops/lab-rules";
import { updateBalloon } from "@/lib/ops/stock";
import { createToken } from "@/lib/ops/tokens";
import { parseStoredDefinition } from "@/lib/validation/chart";
import { unique } from "./support/fixtures";
import * as w from "./support/writes";

afterAll(() => pool.end());

let lab: Awaited<ReturnType<typeof w.labWithSmallChart>>;
type Who = "manager" | "lead" | "educator";
const as = (who: Who): Caller => {
  const { id, email, name } = lab.team.people[who];
  return { kind: "user", user: { id, email, name } };
};
const labRef = () => ({ lab: lab.team.lab.slug });
const balloonAt = async (d: number) =>
  (await db.select().from(balloons).where(eq(balloons.familyId, lab.familyId))).find((b) => b.diameterMm === d)!.id;
const draft = async () =>
  (await w.createEdition({ labId: lab.team.lab.id, chartId: lab.chartId, actor: lab.team.people.educator })).id;
const approve = (who: Who, editionId: number) => approveEdition(as(who), { editionId }, { reviewed: true });

async function reword(who: Who, notes: string) {
  const [chart] = await db.select({ definition: charts.definition }).from(charts).where(eq(charts.id, lab.chartId));
  const definition = { ...parseStoredDefinition(chart!.definition), notes };
  await w.updateChart({ labId: lab.team.lab.id, chartId: lab.chartId, userId: lab.team.people[who].id, definition });
}

async function refusal(who: Who, editionId: number): Promise<string> {
  const before = await db.select().from(editions).where(eq(editions.id, editionId));
  const err = await approve(who, editionId).then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  expect((err as AppError).status).toBe(403);
  expect(await db.select().from(editions).where(eq(editions.id, editionId))).toEqual(before);
  return (err as AppError).message;
}

beforeAll(async () => {
  lab = await w.labWithSmallChart({ name: unique("four-eyes") });
  await setLabRules(as("lead"), labRef(), { managersMayApprove: true });
  const first = await draft();
  await approve("lead", first);
});

describe("four eyes", () => {
  it("a manager who changed the stock this chart prints cannot approve the draft it produced", async () => {
    await updateBalloon(as("manager"), { ...labRef(), balloonId: await balloonAt(3.75) }, { inStock: false });
    const ed = await draft();
    const message = await refusal("manager", ed);
    expect(message).toMatch(/you changed the lab's stock \(.*3\.75/);
    expect(message).toMatch(/someone else must approve this edition \(four eyes\)/);
    await approve("lead", ed);
  });

  it("a stock change that does not reach the chart's printed cells does not count", async () => {
    // 2.5 mm is below every POT target of this chart (3.5-4.2 mm), so it decides no cell.
    await updateBalloon(as("manager"), { ...labRef(), balloonId: await balloonAt(2.5) }, { inStock: false });
    await reword("educator", "Reworded by the educator");
    const ed = await draft();
    expect(await approve("manager", ed)).toMatchObject({ status: "approved" });
  });

  it("a change through a machine token the manager created counts as theirs", async () => {
    const created = await createToken(as("manager"), labRef(), { name: "Manager's feed", scopes: ["stock:write"] });
    const token: Caller = {
      kind: "token",
      token: {
        id: created.id,
        name: created.name,
        scopes: ["stock:write"],
        labId: lab.team.lab.id,
        labSlug: lab.team.lab.slug,
      },
    };
    await updateBalloon(token, { ...labRef(), balloonId: await balloonAt(3.75) }, { inStock: true });
    const ed = await draft();
    expect(await refusal("manager", ed)).toMatch(/the lab's stock/);
    await approve("lead", ed);
  });

  it("the medical lead who recorded an exception for the chart cannot approve it; a manager may", async () => {
    await setLabRules(as("lead"), labRef(), {
      exceptions: [{ chartId: lab.chartId, rule: "legibility", reason: "Read at the table only" }],
    });
    const ed = await draft();
    expect(await refusal("lead", ed)).toMatch(
      /you changed the lab rules' exceptions for this chart \(legibility: Read at the table only\)/,
    );
    expect(await approve("manager", ed)).toMatchObject({ status: "approved" });
  });

  it("the chart's own editor is refused, and the refusal names the chart change", async () => {
    await reword("manager", "The manager's words");
    const ed = await draft();
    expect(await refusal("manager", ed)).toMatch(/you changed the chart \(Changed a chart\)/);
    await approve("lead", ed);
  });
});
