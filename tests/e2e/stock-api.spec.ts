// The stock API over HTTP against the running app and the real test database: who may do what,
// and every refusal of the import. Valid writes by lower roles are refused and change nothing.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { ROUTES, type Actor } from "../authz/matrix";
import { apiAs } from "./support/auth";

const ACTORS: Actor[] = ["anonymous", "manager", "lead", "educator", "operator"];
const STOCK_ROWS = ROUTES.filter((r) => r.route.startsWith("/api/v1/labs/[slug]/stock"));
const clients = new Map<Actor, APIRequestContext>();

test.beforeAll(async ({ baseURL }) => {
  for (const actor of ACTORS) clients.set(actor, await apiAs(baseURL!, actor));
});
test.afterAll(async () => {
  for (const c of clients.values()) await c.dispose();
});

const client = (actor: Actor) => clients.get(actor)!;
const stockOf = async (slug: string) => {
  const res = await client("manager").get(`/api/v1/labs/${slug}/stock`);
  expect(res.status()).toBe(200);
  return res.json();
};
const upload = (actor: Actor, query: string, name: string, buffer: Buffer, mimeType = "text/csv") =>
  client(actor).post(`/api/v1/labs/demo/stock/import${query}`, { multipart: { file: { name, mimeType, buffer } } });

test("every stock route answers each role as the authorization matrix says", async () => {
  expect(STOCK_ROWS.length).toBe(15);
  const before = await stockOf("demo");
  const seen: string[] = [];
  for (const row of STOCK_ROWS) {
    const url = typeof row.url === "string" ? row.url : row.url({});
    for (const actor of ACTORS) {
      const res = await client(actor).fetch(url, {
        method: row.method,
        ...(row.body === undefined ? {} : { data: row.body }),
      });
      seen.push(`${row.method} ${row.route} ${actor} ${res.status()}`);
      expect.soft(res.status(), `${row.method} ${url} as ${actor}`).toBe(row.expect?.[actor]);
    }
  }
  expect(seen).toHaveLength(STOCK_ROWS.length * ACTORS.length);
  expect(await stockOf("demo")).toEqual(before);
});

test("GET returns the documented shape with numbers as numbers and balloons by diameter", async () => {
  const res = await client("operator").get("/api/v1/labs/demo/stock");
  expect(res.status()).toBe(200);
  const body = await res.json();
  const famA = body.balloonFamilies.find((f: { name: string }) => f.name === "NC family A (illustrative)");
  expect(famA).toMatchObject({ compliance: "nc", nominalAtm: 12, rbpAtm: 20, growthAtRbpMm: 0.2 });
  const diameters = famA.balloons.map((b: { diameterMm: number }) => b.diameterMm);
  expect(diameters).toEqual([...diameters].sort((a, b) => a - b));
  expect(famA.balloons.find((b: { diameterMm: number }) => b.diameterMm === 4.75)).toMatchObject({ inStock: false });
  const platformX = body.stentPlatforms.find((p: { name: string }) => p.name === "DES platform X (illustrative)");
  expect(platformX.sizes[0]).toEqual({ id: expect.any(Number), nominalMm: 2.25, maxPostDilatationMm: 3.5 });
  expect(typeof body.revision).toBe("number");
});

test("lead, educator and operator are refused valid writes (403) and nothing changes", async () => {
  const before = await stockOf("demo");
  const balloon = before.balloonFamilies[0].balloons[0];
  const csv = Buffer.from("family,compliance,diameter_mm,in_stock\nNC family A (illustrative),nc,2.00,no\n");
  for (const actor of ["lead", "educator", "operator"] as const) {
    expect(
      (
        await client(actor).patch(`/api/v1/labs/demo/stock/balloons/${balloon.id}`, {
          data: { inStock: !balloon.inStock },
        })
      ).status(),
    ).toBe(403);
    expect(
      (
        await client(actor).post("/api/v1/labs/demo/stock/families", {
          data: { name: "Sneaky (illustrative)", compliance: "nc", nominalAtm: 10, rbpAtm: 16 },
        })
      ).status(),
    ).toBe(403);
    expect(
      (await client(actor).delete(`/api/v1/labs/demo/stock/families/${before.balloonFamilies[0].id}`)).status(),
    ).toBe(403);
    expect((await upload(actor, "", "stock.csv", csv)).status()).toBe(403);
  }
  expect(
    (
      await client("anonymous").patch(`/api/v1/labs/demo/stock/balloons/${balloon.id}`, { data: { inStock: false } })
    ).status(),
  ).toBe(401);
  expect(await stockOf("demo")).toEqual(before);
});

test("another lab's member gets 404, and so does an id from another lab", async () => {
  // The operator belongs to demo only.
  expect((await client("operator").get("/api/v1/labs/demo-north/stock")).status()).toBe(404);
  expect((await client("operator").get("/api/v1/labs/no-such-lab/stock")).status()).toBe(404);
  const north = await stockOf("demo-north");
  const demo = await stockOf("demo");
  const northBalloon = north.balloonFamilies[0].balloons[0];
  const manager = client("manager");
  const tries = [
    manager.patch(`/api/v1/labs/demo/stock/balloons/${northBalloon.id}`, { data: { inStock: false } }),
    manager.delete(`/api/v1/labs/demo/stock/balloons/${northBalloon.id}`),
    manager.patch(`/api/v1/labs/demo/stock/families/${north.balloonFamilies[0].id}`, { data: { name: "Taken over" } }),
    manager.post(`/api/v1/labs/demo/stock/families/${north.balloonFamilies[0].id}/balloons`, {
      data: { diameterMm: 5 },
    }),
    manager.delete(`/api/v1/labs/demo/stock/platforms/${north.stentPlatforms[0].id}`),
    manager.patch(`/api/v1/labs/demo/stock/sizes/${north.stentPlatforms[0].sizes[0].id}`, {
      data: { maxPostDilatationMm: 4 },
    }),
  ];
  for (const res of await Promise.all(tries)) expect(res.status()).toBe(404);
  expect(await stockOf("demo-north")).toEqual(north);
  expect(await stockOf("demo")).toEqual(demo);
});

test("a manager's change: 200, one revision, duplicates 409, bad input 400 with the field", async () => {
  const before = await stockOf("demo");
  const fam = before.balloonFamilies.find((f: { name: string }) => f.name === "SC family B (illustrative)");
  const b = fam.balloons[0];
  const manager = client("manager");
  const off = await manager.patch(`/api/v1/labs/demo/stock/balloons/${b.id}`, { data: { inStock: !b.inStock } });
  expect(off.status()).toBe(200);
  expect(await off.json()).toMatchObject({ revision: before.revision + 1, balloon: { id: b.id, inStock: !b.inStock } });
  const back = await manager.patch(`/api/v1/labs/demo/stock/balloons/${b.id}`, { data: { inStock: b.inStock } });
  expect((await back.json()).revision).toBe(before.revision + 2);

  const dup = await manager.post(`/api/v1/labs/demo/stock/families/${fam.id}/balloons`, {
    data: { diameterMm: b.diameterMm },
  });
  expect(dup.status()).toBe(409);
  expect((await dup.json()).error.message).toContain("already has a");
  const bad = await manager.post("/api/v1/labs/demo/stock/families", {
    data: { name: "X", compliance: "nc", nominalAtm: 20, rbpAtm: 12 },
  });
  expect(bad.status()).toBe(400);
  expect(await bad.json()).toEqual({
    error: {
      code: "invalid_input",
      message: "rbpAtm: Rated burst pressure must be above the nominal pressure.",
      issues: [{ path: ["rbpAtm"], message: "Rated burst pressure must be above the nominal pressure." }],
    },
  });
  const after = await stockOf("demo");
  expect(after.revision).toBe(before.revision + 2);
  expect({ ...after, revision: 0 }).toEqual({ ...before, revision: 0 });
});

test.describe("import refusals change nothing", () => {
  let before: unknown;
  test.beforeEach(async () => {
    before = await stockOf("demo");
  });
  test.afterEach(async () => {
    expect(await stockOf("demo")).toEqual(before);
  });

  test("over 1 MB: 413", async () => {
    const res = await upload("manager", "", "big.csv", Buffer.alloc(1024 * 1024 + 1, "a"));
    expect(res.status()).toBe(413);
    expect((await res.json()).error.message).toContain("the limit is 1 MB");
  });

  test("over 5,000 rows: 413", async () => {
    const lines = ["family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm"];
    for (let i = 0; i < 5001; i++)
      lines.push(`Bulk ${Math.floor(i / 100)},nc,${(1 + (i % 100) * 0.05).toFixed(2)},yes,12,20`);
    const res = await upload("manager", "?dryRun=1", "rows.csv", Buffer.from(lines.join("\n")));
    expect(res.status()).toBe(413);
    expect((await res.json()).error.message).toContain("more than 5,000 rows");
  });

  test("not text: NUL bytes, invalid UTF-8, a workbook", async () => {
    const nul = await upload(
      "manager",
      "",
      "nul.csv",
      Buffer.from("family,compliance,diameter_mm,in_stock\nA\0,nc,2,yes\n"),
    );
    expect(nul.status()).toBe(400);
    expect((await nul.json()).error.message).toContain("not text");
    const latin1 = await upload(
      "manager",
      "",
      "latin1.csv",
      Buffer.from("family,compliance,diameter_mm,in_stock\nCaf\xe9,nc,2,yes\n", "latin1"),
    );
    expect(latin1.status()).toBe(400);
    expect((await latin1.json()).error.message).toContain("not valid UTF-8 text (first bad character on line 2)");
    const zip = await upload(
      "manager",
      "",
      "stock.xlsx",
      Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 6, 0, ...new Array(60).fill(0)]),
      "application/octet-stream",
    );
    expect(zip.status()).toBe(400);
    expect((await zip.json()).error.message).toContain("not CSV text");
  });

  test("bad lines: 400 naming each line and reason, whether dry run or not", async () => {
    const csv = Buffer.from(
      [
        "family;compliance;diameter_mm;in_stock",
        "NC family A (illustrative);nc;2,00;no",
        "NC family A (illustrative);nc;2,33;yes",
        "NC family A (illustrative);xx;3,00;perhaps",
        "New family (illustrative);nc;2,00;yes",
      ].join("\r\n"),
    );
    for (const query of ["?dryRun=1", ""]) {
      const res = await upload("manager", query, "bad.csv", csv);
      expect(res.status()).toBe(400);
      const { error } = await res.json();
      expect(error.code).toBe("invalid_input");
      expect(error.issues).toEqual([
        {
          path: ["line", 3, "diameter_mm"],
          message: "Line 3: diameter_mm: Diameter must be a multiple of 0.05 mm (for example 2.25 or 2.30).",
        },
        { path: ["line", 4, "compliance"], message: 'Line 4: compliance: "xx" is not "nc" or "sc".' },
        {
          path: ["line", 4, "in_stock"],
          message: 'Line 4: in_stock: "perhaps" is not one of yes, no, y, n, true, false, 1, 0.',
        },
      ]);
    }
    const plan = await upload(
      "manager",
      "",
      "new.csv",
      Buffer.from("family,compliance,diameter_mm,in_stock\nNew family (illustrative),nc,2.00,yes\n"),
    );
    expect(plan.status()).toBe(400);
    expect((await plan.json()).error.issues[0].message).toBe(
      "Line 2: New family (illustrative) is a new family: give its nominal_atm and rbp_atm (on at least one of its lines).",
    );
  });

  test("no file, or a preview made on an older revision: refused", async () => {
    expect((await client("manager").post("/api/v1/labs/demo/stock/import")).status()).toBe(400);
    const csv = Buffer.from("family,compliance,diameter_mm,in_stock\nSC family B (illustrative),sc,1.50,no\n");
    const res = await upload("manager", `?revision=${(before as { revision: number }).revision - 1}`, "old.csv", csv);
    expect(res.status()).toBe(409);
    expect((await res.json()).error.message).toContain("Preview the file again");
  });

  test("a dry run answers the preview and changes nothing", async () => {
    const csv = Buffer.from(
      'family,compliance,diameter_mm,in_stock\nSC family B (illustrative),sc,1.50,no\nSC family B (illustrative),sc,"4,50",yes\n',
    );
    const res = await upload("manager", "?dryRun=1", "preview.csv", csv);
    expect(res.status()).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({ dryRun: true, applied: false, revision: (before as { revision: number }).revision });
    expect(body.plan.balloonsToAdd).toEqual([
      { family: "SC family B (illustrative)", familyId: expect.any(Number), diameterMm: 4.5, inStock: true, line: 3 },
    ]);
    expect(body.plan.balloonsToChange.map((b: { diameterMm: number }) => b.diameterMm)).toEqual([1.5]);
    expect(body.plan.balloonsToMarkOutOfStock.length).toBeGreaterThan(5);
  });
});
