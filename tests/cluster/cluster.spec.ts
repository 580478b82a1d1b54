// Two app instances on two nodes of a Galera cluster (started by tests/cluster/run.ts): A on
// node 1, B on node 2. Row locks do not cross nodes, so racing writers meet at COMMIT and the
// loser is retried (lib/ops/transaction.ts); nothing may be lost, counted twice or half written,
// and losing a node may cost an instance its answers but never its correctness.
import { expect, request, test, type APIRequestContext } from "@playwright/test";
import mysql from "mysql2/promise";
import { clusterNodes, killNode, nodeStatus, startNode, waitSynced } from "../../db/cluster";
import { loadLocalEnv } from "../../db/local-env";
import { demoEmail, signInApi } from "../e2e/support/auth";

loadLocalEnv();
test.describe.configure({ mode: "serial" });

const A = process.env.CLUSTER_A_URL!;
const B = process.env.CLUSTER_B_URL!;
const nodes = clusterNodes();
const pools = nodes.map((n) =>
  mysql.createPool({
    host: "127.0.0.1",
    port: n.port,
    user: process.env.DB_USER ?? "forkwall",
    password: process.env.DB_PASSWORD,
    database: process.env.DB_NAME,
    connectionLimit: 2,
    timezone: "Z",
  }),
);

async function q<T>(node: number, sql: string, params: unknown[] = []): Promise<T[]> {
  const [rows] = await pools[node]!.query(sql, params);
  return rows as T[];
}

let a: APIRequestContext;
let b: APIRequestContext;
let anon: APIRequestContext;
let token: string;
let labId: number;
let potChart: number;
let firstNotice: number;
let mailsBefore: number;

const mailCount = async () =>
  (
    (await (
      await fetch(`${process.env.MAIL_FAKE_URL}/messages?to=${demoEmail("manager")}`, {
        headers: { authorization: `Bearer ${process.env.MAIL_FAKE_SECRET}` },
      })
    ).json()) as unknown[]
  ).length;
const revision = async (node = 0) =>
  Number((await q<{ r: number }>(node, "SELECT stock_revision AS r FROM labs WHERE id = ?", [labId]))[0]!.r);
const check = async (base: string) => {
  const res = await anon.get(`${base}/api/v1/check/${token}`, { timeout: 15_000 });
  return {
    code: res.status(),
    body: (await res.json().catch(() => null)) as { status?: string; error?: { message: string } },
  };
};
const patchBalloon = (api: APIRequestContext, base: string, id: number, inStock: boolean) =>
  api.patch(`${base}/api/v1/labs/demo/stock/balloons/${id}`, { data: { inStock }, timeout: 60_000 });

async function balloons(): Promise<{ id: number; d: number }[]> {
  return (
    await q<{ id: number; d: string }>(
      0,
      "SELECT b.id, b.diameter_mm AS d FROM balloons b JOIN balloon_families f ON f.id = b.family_id WHERE f.lab_id = ? AND b.in_stock = 1 ORDER BY f.name = 'NC family A (illustrative)' DESC, b.id",
      [labId],
    )
  ).map((r) => ({ id: Number(r.id), d: Number(r.d) }));
}

test.beforeAll(async () => {
  const [lab] = await q<{ id: number }>(0, "SELECT id FROM labs WHERE slug = 'demo'");
  labId = Number(lab!.id);
  const [pot] = await q<{ chart: number; token: string }>(
    0,
    "SELECT c.id AS chart, e.check_token AS token FROM charts c JOIN editions e ON e.chart_id = c.id WHERE c.lab_id = ? AND c.title = 'POT balloon chart (demo)' AND e.status = 'approved'",
    [labId],
  );
  potChart = Number(pot!.chart);
  token = pot!.token;
  const [n] = await q<{ m: number | null }>(0, "SELECT MAX(id) AS m FROM stale_notices");
  firstNotice = Number(n!.m ?? 0);
  mailsBefore = await mailCount();
  anon = await request.newContext();
  a = await request.newContext({ baseURL: A });
  await signInApi(a, demoEmail("manager"));
  b = await request.newContext({ baseURL: B });
  await signInApi(b, demoEmail("manager"));
});

test.afterAll(async () => {
  await Promise.all(pools.map((p) => p.end()));
});

test("a stock change through A turns the posted copy outdated on B's check page within one second", async () => {
  expect((await check(A)).body.status).toBe("current");
  expect((await check(B)).body.status).toBe("current");
  const target = (await balloons()).find((x) => x.d === 3.75)!;
  expect((await patchBalloon(a, A, target.id, false)).status()).toBe(200);
  const t0 = Date.now();
  let status = "";
  while (Date.now() - t0 < 3000 && status !== "outdated") status = (await check(B)).body.status ?? "";
  const elapsed = Date.now() - t0;
  console.log(`B saw the change ${elapsed} ms after A's response`);
  expect(status).toBe("outdated");
  expect(elapsed).toBeLessThan(1000);
  expect((await patchBalloon(b, B, target.id, true)).status()).toBe(200);
  await expect.poll(async () => (await check(A)).body.status).toBe("current");
});

test("racing stock changes through both instances on one lab: none lost, one lab pass each", async () => {
  const picked = (await balloons()).slice(0, 8);
  expect(picked).toHaveLength(8);
  for (const [inStock, label] of [
    [false, "out"],
    [true, "back"],
  ] as const) {
    const rev = await revision();
    const [audit] = await q<{ m: number | null }>(0, "SELECT MAX(id) AS m FROM audit_events");
    const responses = await Promise.all(
      picked.map((x, i) => (i % 2 === 0 ? patchBalloon(a, A, x.id, inStock) : patchBalloon(b, B, x.id, inStock))),
    );
    const codes = responses.map((r) => r.status());
    console.log(`${label}: responses ${codes.join(",")}`);
    expect(codes, "every racing change is accepted").toEqual(picked.map(() => 200));
    // Every change bumped the revision once, in its own committed transaction: no lost update,
    // and no rolled-back attempt counted.
    expect(await revision()).toBe(rev + picked.length);
    const revisions = await q<{ r: string }>(
      0,
      "SELECT JSON_VALUE(detail, '$.revision') AS r FROM audit_events WHERE lab_id = ? AND action LIKE 'stock.%' AND id > ? ORDER BY id",
      [labId, Number(audit!.m ?? 0)],
    );
    expect(revisions.map((r) => Number(r.r)).sort((x, y) => x - y)).toEqual(picked.map((_, i) => rev + i + 1));
    const states = await q<{ s: number }>(
      0,
      `SELECT in_stock AS s FROM balloons WHERE id IN (${picked.map(() => "?").join(",")})`,
      picked.map((x) => x.id),
    );
    expect(states.map((s) => Boolean(s.s))).toEqual(picked.map(() => inStock));
    // The lab pass stored the live fingerprint of the final stock on both nodes alike.
    const live = async (node: number) =>
      (await q<{ f: string }>(node, "SELECT live_fingerprint AS f FROM charts WHERE lab_id = ? ORDER BY id", [labId]))
        .map((r) => r.f)
        .join();
    await expect.poll(() => live(1)).toBe(await live(0));
  }
  await expect.poll(async () => (await check(A)).body.status).toBe("current");
  expect((await check(B)).body.status).toBe("current");
});

test("racing new editions through both instances: one draft made once, the others answered with it", async () => {
  const post = (api: APIRequestContext, base: string) =>
    api.post(`${base}/api/v1/charts/${potChart}/editions`, { data: {}, timeout: 60_000 });
  const before = await q(0, "SELECT id FROM editions WHERE chart_id = ?", [potChart]);
  const res = await Promise.all([post(a, A), post(b, B), post(a, A), post(b, B)]);
  // The chart did not change in between, so one draft is made and the rest get that same draft.
  expect(res.map((r) => r.status()).sort()).toEqual([200, 200, 200, 201]);
  const ids = await Promise.all(res.map(async (r) => ((await r.json()) as { id: number }).id));
  expect(new Set(ids).size).toBe(1);
  const after = await q(0, "SELECT id FROM editions WHERE chart_id = ?", [potChart]);
  expect(after.length - before.length).toBe(1);
});

test("a node dies: instances on live nodes keep answering, B says 503; the node rejoins and catches up", async () => {
  await killNode(nodes[1]!);
  const seen = { a: new Map<number, number>(), page: new Map<number, number>(), b: new Map<number, number>() };
  const bump = (m: Map<number, number>, k: number) => m.set(k, (m.get(k) ?? 0) + 1);
  let outage = "";
  const t0 = Date.now();
  while (Date.now() - t0 < 8000) {
    const [fromA, page, fromB] = await Promise.all([
      check(A),
      anon.get(`${A}/v/${token}`, { timeout: 15_000 }),
      check(B),
    ]);
    bump(seen.a, fromA.code);
    bump(seen.page, page.status());
    bump(seen.b, fromB.code);
    if (fromB.code === 503) outage = fromB.body.error?.message ?? "";
    await new Promise((r) => setTimeout(r, 200));
  }
  console.log(
    "while node2 is down:",
    JSON.stringify(Object.fromEntries(Object.entries(seen).map(([k, m]) => [k, [...m]]))),
  );
  expect([...seen.a.keys()]).toEqual([200]);
  expect([...seen.page.keys()]).toEqual([200]);
  expect([...seen.b.keys()], "B, whose node is gone, answers only with the outage").toEqual([503]);
  expect(outage).toContain("nothing was changed");

  // The two live nodes are still the primary component: a change through A lands.
  expect((await nodeStatus(nodes[0]!))?.clusterSize).toBe(2);
  const target = (await balloons()).find((x) => x.d === 4)!;
  expect((await patchBalloon(a, A, target.id, false)).status()).toBe(200);
  expect((await check(A)).body.status).toBe("outdated");

  // node2 rejoins (incremental state transfer), catches up, and B answers again with the news.
  const t1 = Date.now();
  await startNode(nodes[1]!, nodes);
  await waitSynced(nodes[0]!, { size: 3 });
  console.log(`node2 rejoined and Synced in ${Date.now() - t1} ms`);
  expect(await revision(1)).toBe(await revision(0));
  await expect.poll(async () => (await check(B)).code, { timeout: 15_000 }).toBe(200);
  expect((await check(B)).body.status).toBe("outdated");
  expect((await patchBalloon(b, B, target.id, true)).status()).toBe(200);
  await expect.poll(async () => (await check(A)).body.status).toBe("current");
});

test("everywhere alike: no duplicate notices, no partial editions, the same rows on all three nodes", async () => {
  // Each stale notice was stored once per change; each digest (the notices one claim took
  // together, stamped with one sent_at) was mailed once, though both instances run the timer.
  const notices = await q<{ id: number; key: string; sent: Date | null }>(
    0,
    "SELECT id, change_key AS `key`, sent_at AS sent FROM stale_notices WHERE id > ? ORDER BY id",
    [firstNotice],
  );
  expect(notices.length).toBeGreaterThanOrEqual(2);
  expect(new Set(notices.map((n) => n.key)).size).toBe(notices.length);
  await expect.poll(async () => (await q(0, "SELECT id FROM stale_notices WHERE sent_at IS NULL")).length).toBe(0);
  const mailed = await q<{ sent: Date }>(
    0,
    "SELECT DISTINCT sent_at AS sent FROM stale_notices WHERE id > ? AND JSON_VALUE(detail, '$.outcome') IN ('digest', 'all-clear')",
    [firstNotice],
  );
  expect(mailed.length).toBeGreaterThanOrEqual(1);
  await expect.poll(mailCount).toBe(mailsBefore + mailed.length);
  // No edition without its frozen content, no number given twice on one chart.
  expect(
    await q(0, "SELECT id FROM editions WHERE snapshot IS NULL OR fingerprint IS NULL OR check_token IS NULL"),
  ).toEqual([]);
  expect(await q(0, "SELECT chart_id, number FROM editions GROUP BY chart_id, number HAVING COUNT(*) > 1")).toEqual([]);
  // And all three nodes hold the same rows.
  const tables = [
    "labs",
    "balloons",
    "balloon_families",
    "charts",
    "editions",
    "postings",
    "stale_notices",
    "audit_events",
  ];
  const sums = async (node: number) =>
    JSON.stringify(await q(node, `CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(", ")}`));
  for (const node of [1, 2]) await expect.poll(() => sums(node)).toBe(await sums(0));
});
