// Two app instances on one database: a change made through one is what the other reports at
// once, and changes racing through both are serialised per lab (one e-mail for the copies they
// make stale, every revision counted).
import { spawn, type ChildProcess } from "node:child_process";
import { expect, test, type APIRequestContext } from "@playwright/test";
import { demoEmail, signInApi } from "./support/auth";
import { demoIds, query } from "./support/db";
import { mailTo } from "../support/mail";
import { settleStaleMail } from "./support/mail";

const PORT_B = Number(process.env.PORT ?? 3100) + 5;
const B = `http://localhost:${PORT_B}`;
let second: ChildProcess;

test.beforeAll(async () => {
  second = spawn(
    process.execPath,
    ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(PORT_B)],
    {
      env: { ...process.env, PORT: String(PORT_B) },
      stdio: "ignore",
    },
  );
  await expect
    .poll(async () => (await fetch(`${B}/api/health`).catch(() => null))?.status ?? 0, { timeout: 60_000 })
    .toBe(200);
});

test.afterAll(() => {
  second?.kill("SIGTERM");
});

async function balloonId(diameter: number): Promise<number> {
  const [row] = await query<{ id: number }>(
    "SELECT b.id FROM balloons b JOIN balloon_families f ON f.id = b.family_id JOIN labs l ON l.id = f.lab_id WHERE l.slug = 'demo' AND f.name = 'NC family A (illustrative)' AND b.diameter_mm = ?",
    [diameter],
  );
  return Number(row!.id);
}

const revision = async () =>
  Number((await query<{ r: number }>("SELECT stock_revision AS r FROM labs WHERE slug = 'demo'"))[0]!.r);
const patch = (api: APIRequestContext, base: string, id: number, inStock: boolean) =>
  api.patch(`${base}/api/v1/labs/demo/stock/balloons/${id}`, { data: { inStock } });

test("what one instance changes, the other reports; racing changes through both are serialised", async ({
  playwright,
  baseURL,
}) => {
  const ids = await demoIds();
  const api = await playwright.request.newContext();
  const a = await playwright.request.newContext({ baseURL });
  await signInApi(a, demoEmail("manager"));
  const b = await playwright.request.newContext({ baseURL: B });
  await signInApi(b, demoEmail("manager"));

  const check = async (base: string) =>
    (await (await api.get(`${base}/api/v1/check/${ids["token:pot"]}`)).json()) as {
      status: string;
      changes: { detail: string }[];
    };
  expect((await check(baseURL!)).status).toBe("current");
  expect((await check(B)).status).toBe("current");

  // Through A, read on B.
  const b375 = await balloonId(3.75);
  expect((await patch(a, baseURL!, b375, false)).status()).toBe(200);
  const onB = await check(B);
  expect(onB.status).toBe("outdated");
  expect(onB.changes.map((c) => c.detail)).toContain(
    "3.75 mm NC balloon no longer stocked (NC family A (illustrative))",
  );
  expect((await patch(b, B, b375, true)).status()).toBe(200);
  expect((await check(baseURL!)).status).toBe("current");

  // Two changes racing through both instances: both land, in turn, and the copies they make
  // stale are announced once.
  await settleStaleMail(demoEmail("manager"));
  const mails = (await mailTo(demoEmail("manager"))).length;
  const rev = await revision();
  const [r1, r2] = await Promise.all([
    patch(a, baseURL!, await balloonId(4), false),
    patch(b, B, await balloonId(4.25), false),
  ]);
  expect([r1.status(), r2.status()]).toEqual([200, 200]);
  expect(await revision()).toBe(rev + 2);
  await expect.poll(async () => (await mailTo(demoEmail("manager"))).length).toBe(mails + 1);
  const both = await check(B);
  expect(both.status).toBe("outdated");
  expect(both.changes.map((c) => c.detail)).toEqual(
    expect.arrayContaining([
      "4.00 mm NC balloon no longer stocked (NC family A (illustrative))",
      "4.25 mm NC balloon no longer stocked (NC family A (illustrative))",
    ]),
  );

  await Promise.all([patch(a, baseURL!, await balloonId(4), true), patch(b, B, await balloonId(4.25), true)]);
  expect((await check(baseURL!)).status).toBe("current");
  expect((await check(B)).status).toBe("current");
});
