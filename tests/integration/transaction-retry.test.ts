// runTransaction on the real MariaDB: a deadlock forced between two connections is retried and
// both writers land exactly once; effects queued by the losing attempt never run; with retries
// off the loser's error surfaces; other errors are never retried.
import { eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { createDb, createPool } from "@/db";
import { labs } from "@/db/schema";
import { env } from "@/lib/env";
import { retryableError, runTransaction, type Tx } from "@/lib/ops/transaction";
import { createLab } from "./support/fixtures";

const poolA = createPool(env.DATABASE_URL);
const poolB = createPool(env.DATABASE_URL);
const dbA = createDb(poolA);
const dbB = createDb(poolB);
afterAll(async () => {
  await poolA.end();
  await poolB.end();
});

function latch() {
  let open!: () => void;
  const opened = new Promise<void>((r) => (open = r));
  return { open, opened };
}

const bump = (tx: Tx, labId: number) =>
  tx
    .update(labs)
    .set({ stockRevision: sql`${labs.stockRevision} + 1` })
    .where(eq(labs.id, labId));

const revision = async (labId: number) =>
  (await dbA.select({ r: labs.stockRevision }).from(labs).where(eq(labs.id, labId)))[0]!.r;

/**
 * Two transactions lock two lab rows in opposite order, each waiting until the other holds its
 * first row, so InnoDB must pick a victim (error 1213). Retries run without the rendezvous.
 */
async function forceDeadlock(retries: number) {
  const [one, two] = [await createLab("tx-one"), await createLab("tx-two")];
  const [r1, r2] = [await revision(one.id), await revision(two.id)];
  const aHolds = latch();
  const bHolds = latch();
  const runs = { a: 0, b: 0 };
  const effects = { a: [] as number[], b: [] as number[] };
  const after = { a: 0, b: 0 };
  const retried: string[] = [];
  const writer = (
    name: "a" | "b",
    database: typeof dbA,
    first: number,
    second: number,
    mine: ReturnType<typeof latch>,
    theirs: ReturnType<typeof latch>,
  ) =>
    runTransaction(
      async (tx, ctx) => {
        runs[name]++;
        await bump(tx, first);
        ctx.afterCommit(() => effects[name].push(ctx.attempt));
        if (ctx.attempt === 0) {
          mine.open();
          await theirs.opened;
        }
        await bump(tx, second);
        return name;
      },
      {
        db: database,
        retries,
        onRetry: ({ error }) => retried.push(`${name}:${error}`),
        afterCommit: () => void after[name]++,
      },
    );
  const settled = await Promise.allSettled([
    writer("a", dbA, one.id, two.id, aHolds, bHolds),
    writer("b", dbB, two.id, one.id, bHolds, aHolds),
  ]);
  return { one, two, r1, r2, settled, runs, effects, after, retried };
}

describe("runTransaction", () => {
  it("retries the deadlock victim: both writers land once, effects of the lost attempt never run", async () => {
    const r = await forceDeadlock(5);
    expect(r.settled.map((s) => s.status)).toEqual(["fulfilled", "fulfilled"]);
    expect(r.retried.length).toBeGreaterThanOrEqual(1);
    expect(r.retried.every((e) => e.endsWith("ER_LOCK_DEADLOCK"))).toBe(true);
    expect(r.runs.a + r.runs.b).toBe(2 + r.retried.length);
    // Every row was bumped once by each writer, never by a rolled-back attempt.
    expect(await revision(r.one.id)).toBe(r.r1 + 2);
    expect(await revision(r.two.id)).toBe(r.r2 + 2);
    // Each writer's queued effect ran once, from its committing attempt; the option's once.
    expect(r.effects.a).toHaveLength(1);
    expect(r.effects.b).toHaveLength(1);
    expect(r.effects.a[0]! + r.effects.b[0]!).toBe(r.retried.length);
    expect(r.after).toEqual({ a: 1, b: 1 });
  });

  it("with retries off the victim's deadlock surfaces and its effects never run", async () => {
    const r = await forceDeadlock(0);
    const failed = r.settled.filter((s) => s.status === "rejected");
    expect(failed).toHaveLength(1);
    expect(retryableError((failed[0] as PromiseRejectedResult).reason)).toBe("ER_LOCK_DEADLOCK");
    expect(r.after.a + r.after.b).toBe(1);
    expect(r.effects.a.length + r.effects.b.length).toBe(1);
    expect(await revision(r.one.id)).toBe(r.r1 + 1);
    expect(await revision(r.two.id)).toBe(r.r2 + 1);
  });

  it("does not retry other errors, and queues nothing from a failed run", async () => {
    const lab = await createLab("tx-plain");
    const before = await revision(lab.id);
    let runs = 0;
    let effects = 0;
    await expect(
      runTransaction(
        async (tx, ctx) => {
          runs++;
          await bump(tx, lab.id);
          ctx.afterCommit(() => void effects++);
          throw new Error("refused by a rule");
        },
        { db: dbA, retries: 5, afterCommit: () => void effects++ },
      ),
    ).rejects.toThrow("refused by a rule");
    expect(runs).toBe(1);
    expect(effects).toBe(0);
    expect(await revision(lab.id)).toBe(before);
  });

  it("finds 1213 and 1205 through cause chains, by code or by errno, and nothing else", () => {
    const deadlock = Object.assign(new Error("Deadlock found"), { code: "ER_LOCK_DEADLOCK", errno: 1213 });
    expect(retryableError(new Error("Failed query", { cause: deadlock }))).toBe("ER_LOCK_DEADLOCK");
    expect(retryableError(new Error("outer", { cause: new Error("mid", { cause: { errno: 1205 } }) }))).toBe(
      "errno 1205",
    );
    expect(retryableError(Object.assign(new Error("dup"), { code: "ER_DUP_ENTRY", errno: 1062 }))).toBeNull();
    const loop: { cause?: unknown } = {};
    loop.cause = loop;
    expect(retryableError(loop)).toBeNull();
    expect(retryableError(undefined)).toBeNull();
  });
});
