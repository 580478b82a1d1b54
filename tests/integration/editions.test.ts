import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { getChart } from "@/db/queries/charts";
import { refreshLiveSnapshots } from "@/db/queries/lab-changes";
import { getEdition } from "@/db/queries/editions";
import { approveEdition, createChart, createEdition, rejectEdition, withdrawEdition } from "./support/writes";
import { balloonFamilies, balloons, charts, editions, labs, users } from "@/db/schema";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { AppError } from "@/lib/errors";
import { smallPotChart } from "../support/chart-fixtures";
import { stentPlatformFor } from "./support/fixtures";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

// An invented lab of its own, so these tests never depend on the demo seed.
const tag = randomUUID().slice(0, 8);
let labId = 0;
let familyId = 0;
const people: Record<"educator" | "lead" | "manager", { id: number; name: string }> = {
  educator: { id: 0, name: "Test educator" },
  lead: { id: 0, name: "Test lead" },
  manager: { id: 0, name: "Test manager" },
};

beforeAll(async () => {
  const [lab] = await db
    .insert(labs)
    .values({ slug: `ed-${tag}`, name: `Edition test lab ${tag}` })
    .$returningId();
  labId = lab!.id;
  for (const key of Object.keys(people) as (keyof typeof people)[]) {
    const [u] = await db
      .insert(users)
      .values({ email: `${key}-${tag}@forkwall.test`, name: people[key].name, passwordHash: "x" })
      .$returningId();
    people[key].id = u!.id;
  }
  stentId = await stentPlatformFor(labId);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId, name: "NC test family", compliance: "nc", nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: 0.2 })
    .$returningId();
  familyId = fam!.id;
  const sizes = Array.from({ length: 13 }, (_, i) => 2 + i * 0.25);
  await db.insert(balloons).values(sizes.map((d) => ({ labId, familyId, diameterMm: d, inStock: true })));
});

afterAll(() => pool.end());

const definition = () => smallPotChart(familyId, "POT test chart", stentId);

async function expectAppError(p: Promise<unknown>, status: number, text?: RegExp) {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  expect((err as AppError).status).toBe(status);
  if (text) expect((err as AppError).message).toMatch(text);
}

const setInStock = async (diameterMm: number, inStock: boolean) => {
  await db.transaction(async (tx) => {
    await tx
      .update(balloons)
      .set({ inStock })
      .where(and(eq(balloons.familyId, familyId), eq(balloons.diameterMm, diameterMm)));
    await refreshLiveSnapshots(tx, labId);
  });
};

// Each test makes what it needs, so any one of them can run alone or in any order.
const newChart = async () => (await createChart({ labId, userId: people.educator.id, definition: definition() })).id;

describe("clinical guardrails through the database", () => {
  it("refuses a chart that breaks a lookup rule with a 400 naming the rule, and writes nothing", async () => {
    const bad = { ...definition(), title: `Bad rule ${tag}` };
    bad.lookups = [{ ...bad.lookups[0]!, rounding: "down" }];
    const before = await db
      .select({ n: sql<number>`count(*)` })
      .from(charts)
      .where(eq(charts.labId, labId));
    await expectAppError(createChart({ labId, userId: people.educator.id, definition: bad }), 400, /proximal rounding/);
    const after = await db
      .select({ n: sql<number>`count(*)` })
      .from(charts)
      .where(eq(charts.labId, labId));
    expect(Number(after[0]!.n)).toBe(Number(before[0]!.n));
  });

  it("a real (not demo) lab's edition carries no invented-data clause", async () => {
    const chartId = (
      await createChart({ labId, userId: people.educator.id, definition: { ...definition(), title: `Real ${tag}` } })
    ).id;
    const ed = await createEdition({ labId, chartId, actor: people.educator });
    const row = await getEdition({ labId, editionId: ed.id });
    expect(row!.snapshot.caution).toContain("Reference aid only");
    expect(row!.snapshot.caution).not.toContain("invented");
    expect(row!.snapshot.caps).toEqual({ upMm: 0.25, downMm: 0.5 });
  });
});

async function approvedEdition() {
  const chartId = await newChart();
  const ed = await createEdition({ labId, chartId, actor: people.educator });
  await approveEdition({ labId, editionId: ed.id, actor: people.lead });
  return ed;
}

describe("editions", () => {
  it("freezes the chart into a numbered draft whose fingerprint is the SHA-256 of its canonical snapshot", async () => {
    const chartId = await newChart();
    const ed = await createEdition({ labId, chartId, actor: people.educator });
    expect(ed.number).toBe(1);
    const row = await getEdition({ labId, editionId: ed.id });
    expect(row!.status).toBe("draft");
    expect(row!.fingerprint).toBe(fingerprintOf(row!.snapshot));
    expect(row!.checkToken).toMatch(/^[A-Za-z0-9_-]{24}$/);
    expect((await getChart({ labId, chartId }))!.liveFingerprint).toBe(row!.fingerprint);
  });

  // Four eyes is decided before this write (lib/editions/four-eyes.ts; tests/integration/four-eyes.test.ts).
  it("approving supersedes the previous approved edition", async () => {
    const chartId = await newChart();
    const first = await createEdition({ labId, chartId, actor: people.educator });
    await approveEdition({ labId, editionId: first.id, actor: people.lead });
    const second = await createEdition({ labId, chartId, actor: people.educator });
    const approved = await approveEdition({ labId, editionId: second.id, actor: people.manager });
    expect(approved.superseded.map((p) => p.number)).toEqual([first.number]);
    expect((await getEdition({ labId, editionId: first.id }))!.status).toBe("superseded");
    expect((await getEdition({ labId, editionId: second.id }))!.approvedByName).toBe("Test manager");
  });

  it("refuses to approve a draft that no longer matches the stock, naming the change", async () => {
    const chartId = await newChart();
    const draft = await createEdition({ labId, chartId, actor: people.educator });
    await setInStock(3.75, false);
    await expectAppError(
      approveEdition({ labId, editionId: draft.id, actor: people.lead }),
      409,
      /3\.75 mm NC balloon no longer stocked/,
    );
    await setInStock(3.75, true);
    await approveEdition({ labId, editionId: draft.id, actor: people.lead });
  });

  it("sends a draft back as returned with its reason, which can then never be approved; withdraws a draft", async () => {
    const chartId = await newChart();
    const draft = await createEdition({ labId, chartId, actor: people.educator });
    await rejectEdition({ labId, editionId: draft.id, actor: people.lead, reason: "Side-branch columns too narrow" });
    const rejected = await getEdition({ labId, editionId: draft.id });
    expect(rejected).toMatchObject({ status: "returned", rejectionReason: "Side-branch columns too narrow" });
    await expectAppError(approveEdition({ labId, editionId: draft.id, actor: people.lead }), 409, /sent back/);
    const next = await createEdition({ labId, chartId, actor: people.educator });
    expect(next.id).not.toBe(draft.id);
    await withdrawEdition({ labId, editionId: next.id, actor: people.manager, reason: "Drawn up in error" });
    await expectAppError(approveEdition({ labId, editionId: next.id, actor: people.lead }), 409, /withdrawn/);
  });

  it("the database itself refuses to change an approved edition's content, status backwards, or to delete it", async () => {
    const { id } = await approvedEdition();
    const [approved] = await db.select().from(editions).where(eq(editions.id, id));
    expect(approved).toMatchObject({ status: "approved" });
    const attempts = [
      sql`UPDATE editions SET fingerprint = REPEAT('0', 64) WHERE id = ${approved!.id}`,
      sql`UPDATE editions SET snapshot = '{}' WHERE id = ${approved!.id}`,
      sql`UPDATE editions SET status = 'draft' WHERE id = ${approved!.id}`,
      sql`UPDATE editions SET approved_by_name = 'Someone else' WHERE id = ${approved!.id}`,
      sql`DELETE FROM editions WHERE id = ${approved!.id}`,
    ];
    for (const stmt of attempts) {
      const err = await db.execute(stmt).then(
        () => null,
        (e: Error) => e,
      );
      // Drizzle wraps the driver's error; the trigger's SIGNAL text is its cause.
      expect(String((err?.cause as Error | undefined)?.message)).toMatch(
        /immutable|approval|backwards|never change|cannot be deleted/,
      );
    }
    const [after] = await db.select().from(editions).where(eq(editions.id, approved!.id));
    expect(after).toEqual(approved);
  });

  it("another lab cannot reach this lab's editions", async () => {
    const [other] = await db
      .insert(labs)
      .values({ slug: `other-${tag}`, name: "Other lab" })
      .$returningId();
    const anyEd = await approvedEdition();
    expect(await getEdition({ labId: other!.id, editionId: anyEd!.id })).toBeNull();
    await expectAppError(approveEdition({ labId: other!.id, editionId: anyEd!.id, actor: people.lead }), 404);
  });
});
