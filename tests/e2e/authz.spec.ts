// Walks the authorization matrix over HTTP: every route row, as anonymous and as each seeded
// role, must answer exactly the status the matrix lists.
import { expect, test } from "@playwright/test";
import { ALL_ROLES, ROUTES, machineStatus, type Actor } from "../authz/matrix";
import { DEMO_PASSWORD, demoEmail, signInApi } from "./support/auth";
import { closeDb, demoIds, query } from "./support/db";

const ACTORS: Actor[] = ["anonymous", ...ALL_ROLES];
const demoState = () =>
  query<{ id: number; role: string }>(
    "SELECT m.id, m.role FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email LIKE '%@forkwall.test' ORDER BY m.id",
  );

let ids: Record<string, number | string>;
let before: Awaited<ReturnType<typeof demoState>>;

test.beforeAll(async () => {
  ids = await demoIds();
  expect(ids["demo:operator"], "seeded demo operator").toBeGreaterThan(0);
  expect(ids["demo-north:operator"], "the operator is not in demo-north").toBeUndefined();
  before = await demoState();
});

test.afterAll(async () => {
  // Walking the table changed none of the seeded memberships.
  expect(await demoState()).toEqual(before);
  await closeDb();
});

for (const actor of ACTORS) {
  test(`as ${actor}, every route answers the status in the matrix`, async ({ playwright, baseURL }) => {
    const request = await playwright.request.newContext({ baseURL });
    if (actor !== "anonymous") await signInApi(request, demoEmail(actor), DEMO_PASSWORD);
    const wrong: string[] = [];
    let walked = 0;
    for (const row of ROUTES) {
      if (row.exempt !== undefined) continue;
      const url = typeof row.url === "function" ? row.url(ids) : row.url;
      const res = await request.fetch(url, { method: row.method, data: row.body, maxRedirects: 0 });
      const want = row.expect![actor];
      walked++;
      if (res.status() !== want)
        wrong.push(`${row.method} ${url}: ${res.status()} (matrix: ${want}) ${(await res.text()).slice(0, 160)}`);
      else if (res.status() >= 400 && url.startsWith("/api/v1/")) {
        const body = (await res.json()) as {
          error?: { code?: string; message?: string; issues?: { path: unknown[] }[] };
        };
        if (!body.error?.code || !body.error.message)
          wrong.push(`${row.method} ${url}: error without code and message`);
        if (res.status() === 400 && !body.error?.issues?.length)
          wrong.push(`${row.method} ${url}: 400 without field issues`);
      }
    }
    expect(walked).toBe(ROUTES.filter((r) => r.exempt === undefined).length);
    expect(wrong, `${actor}: answers that differ from tests/authz/matrix.ts`).toEqual([]);
    await request.dispose();
  });
}

// Machine tokens (Bearer, no cookie, no Origin): the demo lab's stock routes only.
test("as a machine token of the demo lab, every route answers machineStatus", async ({ playwright, baseURL }) => {
  const manager = await playwright.request.newContext({ baseURL });
  await signInApi(manager, demoEmail("manager"), DEMO_PASSWORD);
  const tokens: { id: number; token: string }[] = [];
  // One token per 50 requests, to stay clear of the per-token rate limit.
  const mint = async () => {
    const res = await manager.post("/api/v1/labs/demo/tokens", {
      data: { name: `authz walker ${Date.now()}-${tokens.length}`, scopes: ["stock:read", "stock:write"] },
    });
    expect(res.status()).toBe(201);
    tokens.push((await res.json()) as { id: number; token: string });
  };
  const wrong: string[] = [];
  const rows = ROUTES.filter((r) => r.exempt === undefined);
  for (const [i, row] of rows.entries()) {
    if (i % 50 === 0) await mint();
    const url = typeof row.url === "function" ? row.url(ids) : row.url;
    const machine = await playwright.request.newContext({
      baseURL,
      extraHTTPHeaders: { authorization: `Bearer ${tokens.at(-1)!.token}` },
    });
    const res = await machine.fetch(url, { method: row.method, data: row.body, maxRedirects: 0 });
    const want = machineStatus(row, url);
    if (res.status() !== want)
      wrong.push(`${row.method} ${url}: ${res.status()} (machineStatus: ${want}) ${(await res.text()).slice(0, 160)}`);
    await machine.dispose();
  }
  for (const t of tokens) expect((await manager.delete(`/api/v1/labs/demo/tokens/${t.id}`)).status()).toBe(200);
  await manager.dispose();
  expect(wrong, "machine token: answers that differ from machineStatus in tests/authz/matrix.ts").toEqual([]);
});
