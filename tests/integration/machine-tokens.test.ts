// Machine tokens end to end through the route handlers: a manager creates one, an inventory
// system pushes stock with it (Authorization: Bearer), posted copies turn outdated and the
// managers are mailed, exactly as when a person makes the change; every refusal (another lab,
// another route, a missing scope, a revoked or unknown token, the rate limit) changes nothing.
import { deliverDigest } from "@/lib/ops/notices";
import { and, desc, eq, like, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { getCheckByToken } from "@/lib/ops/check";
import { listAuditEvents } from "@/db/queries/audit";
import { auditEvents, balloonFamilies, balloons, labs, labTokens } from "@/db/schema";
import { env } from "@/lib/env";
import { GET as stockRoute } from "@/app/api/v1/labs/[slug]/stock/route";
import { PATCH as balloonRoute } from "@/app/api/v1/labs/[slug]/stock/balloons/[id]/route";
import { POST as importRoute } from "@/app/api/v1/labs/[slug]/stock/import/route";
import { GET as listTokensRoute, POST as createTokenRoute } from "@/app/api/v1/labs/[slug]/tokens/route";
import { DELETE as revokeTokenRoute } from "@/app/api/v1/labs/[slug]/tokens/[id]/route";
import { GET as membersRoute } from "@/app/api/v1/labs/[slug]/members/route";
import { GET as chartsRoute } from "@/app/api/v1/labs/[slug]/charts/route";
import { PUT as rulesRoute } from "@/app/api/v1/labs/[slug]/rules/route";
import { PATCH as settingsRoute } from "@/app/api/v1/labs/[slug]/settings/route";
import { GET as solveRoute } from "@/app/api/v1/solve/route";
import { labWithTeam, stentPlatformFor } from "./support/fixtures";
import { mailTo } from "../support/mail";
import { approveEdition, createChart, createEdition, createRoom, recordPosting } from "./support/writes";
import { auditCount } from "../support/audit";
import { as } from "../support/roles";
import { send } from "../support/routes";
import { smallPotChart } from "../support/chart-fixtures";

// POT charts need a stent platform (lab rule "POT checked against a stent platform").
let stentId = 0;

// A low limit so the test can reach it; set before lib/env is first read.
const LIMIT = vi.hoisted(() => {
  process.env.TOKEN_RATE_LIMIT_PER_MINUTE = "25";
  return 25;
});
vi.mock("@/lib/auth/session", () => import("../support/session"));

type Team = Awaited<ReturnType<typeof labWithTeam>>;
let team: Team;
const ids = { family: 0, checkToken: "", otherBalloon: 0 };

type TokenAnswer = Record<string, unknown> & {
  token: string;
  id: number;
  tokens: { id: number; name: string; lastUsedAt: string | null }[];
  error: { code: string; message: string; issues?: { path: (string | number)[]; message: string }[] };
};

async function newToken(name: string, scopes: string[]) {
  as(team.people.manager);
  const res = await send<TokenAnswer>(
    createTokenRoute,
    { slug: team.lab.slug },
    { method: "POST", body: { name, scopes } },
  );
  expect(res.status).toBe(201);
  return res.json;
}

const balloonAt = async (labId: number, d: number) =>
  (
    await db
      .select()
      .from(balloons)
      .where(and(eq(balloons.labId, labId), eq(balloons.diameterMm, d)))
  )[0]!;
const revision = async (labId: number) =>
  (await db.select({ r: labs.stockRevision }).from(labs).where(eq(labs.id, labId)))[0]!.r;

beforeAll(async () => {
  team = await labWithTeam();
  stentId = await stentPlatformFor(team.lab.id);
  const [fam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC token family", compliance: "nc", nominalAtm: 12, rbpAtm: 20 })
    .$returningId();
  ids.family = fam!.id;
  await db
    .insert(balloons)
    .values(Array.from({ length: 9 }, (_, i) => ({ labId: team.lab.id, familyId: fam!.id, diameterMm: 2 + i * 0.25 })));
  // The other lab has stock of its own that a token of this lab must not reach.
  const [otherFam] = await db
    .insert(balloonFamilies)
    .values({ labId: team.other.id, name: "Other lab family", compliance: "nc", nominalAtm: 12, rbpAtm: 20 })
    .$returningId();
  const [ob] = await db
    .insert(balloons)
    .values({ labId: team.other.id, familyId: otherFam!.id, diameterMm: 3 })
    .$returningId();
  ids.otherBalloon = ob!.id;

  const definition = smallPotChart(ids.family, "Token POT chart", stentId);
  const labId = team.lab.id;
  const chart = await createChart({ labId, userId: team.people.educator.id, definition });
  const ed = await createEdition({ labId, chartId: chart.id, actor: team.people.educator });
  await approveEdition({ labId, editionId: ed.id, actor: team.people.lead });
  ids.checkToken = ed.checkToken;
  const room = await createRoom({ labId, name: "Procedure room T", actor: team.people.manager });
  await recordPosting({ labId, editionId: ed.id, roomId: room.id, actor: team.people.operator });
});

afterAll(() => pool.end());

describe("managing tokens", () => {
  it("a manager creates a token, shown once: prefixed, 256 random bits, stored only as its SHA-256", async () => {
    const created = await newToken("Inventory system", ["stock:read", "stock:write"]);
    expect(created.token).toMatch(/^fwt_[A-Za-z0-9_-]{43}$/);
    expect(created).toMatchObject({ name: "Inventory system", scopes: ["stock:read", "stock:write"] });
    const [row] = await db.select().from(labTokens).where(eq(labTokens.id, created.id));
    const { createHash } = await import("node:crypto");
    expect(row!.tokenHash).toBe(createHash("sha256").update(created.token).digest("hex"));
    expect(JSON.stringify(row)).not.toContain(created.token.slice(4));
    // Listing never shows the token again.
    const list = await send<TokenAnswer>(listTokensRoute, { slug: team.lab.slug });
    expect(list.status).toBe(200);
    expect(JSON.stringify(list.json)).not.toContain(created.token.slice(4));
    expect(list.json.tokens.map((t) => t.name)).toContain("Inventory system");
  });

  it("only managers manage tokens (403 for other roles, 404 outside the lab, 401 signed out)", async () => {
    for (const who of ["lead", "educator", "operator"] as const) {
      as(team.people[who]);
      expect((await send<TokenAnswer>(listTokensRoute, { slug: team.lab.slug })).status).toBe(403);
      const post = await send<TokenAnswer>(
        createTokenRoute,
        { slug: team.lab.slug },
        { method: "POST", body: { name: "x", scopes: ["stock:read"] } },
      );
      expect(post.status).toBe(403);
    }
    as(team.people.outsider);
    expect((await send<TokenAnswer>(listTokensRoute, { slug: team.lab.slug })).status).toBe(404);
    as(null);
    expect((await send<TokenAnswer>(listTokensRoute, { slug: team.lab.slug })).status).toBe(401);
  });

  it.each([
    [{ name: "", scopes: ["stock:read"] }, "name"],
    [{ name: "ok", scopes: [] }, "scopes"],
    [{ name: "ok", scopes: ["stock:admin"] }, "scopes"],
    [{ name: "ok", scopes: "stock:read" }, "scopes"],
    [{ name: "ok", scopes: ["stock:read"], lab: "other" }, ""],
  ])("refuses %j with 400 naming %s", async (body, field) => {
    as(team.people.manager);
    const before = await db.select({ id: labTokens.id }).from(labTokens).where(eq(labTokens.labId, team.lab.id));
    const res = await send<TokenAnswer>(createTokenRoute, { slug: team.lab.slug }, { method: "POST", body });
    expect(res.status).toBe(400);
    if (field) expect(res.json.error.issues?.some((i) => i.path[0] === field)).toBe(true);
    else expect(res.json.error.message).toMatch(/lab/);
    const after = await db.select({ id: labTokens.id }).from(labTokens).where(eq(labTokens.labId, team.lab.id));
    expect(after).toEqual(before);
  });

  it("refuses a second active token of the same name (409)", async () => {
    as(team.people.manager);
    const res = await send<TokenAnswer>(
      createTokenRoute,
      { slug: team.lab.slug },
      { method: "POST", body: { name: "Inventory system", scopes: ["stock:read"] } },
    );
    expect(res.status).toBe(409);
  });
});

describe("a token at work", () => {
  let rw: TokenAnswer;
  beforeAll(async () => {
    rw = await newToken("Pharmacy feed", ["stock:read", "stock:write"]);
    as(null);
  });

  it("reads its lab's stock with stock:read", async () => {
    const res = await send<TokenAnswer>(stockRoute, { slug: team.lab.slug }, { bearer: rw.token });
    expect(res.status).toBe(200);
    expect(JSON.stringify(res.json)).toContain("NC token family");
  });

  it("pushes a stock change: posted copies turn outdated, managers are mailed, audited as the token", async () => {
    expect((await getCheckByToken({ token: ids.checkToken }))!.status).toBe("current");
    const b = await balloonAt(team.lab.id, 3.25);
    const res = await send<TokenAnswer>(
      balloonRoute,
      { slug: team.lab.slug, id: String(b.id) },
      { method: "PATCH", body: { inStock: false }, bearer: rw.token },
    );
    expect(res.status).toBe(200);
    expect((await balloonAt(team.lab.id, 3.25)).inStock).toBe(false);
    const check = await getCheckByToken({ token: ids.checkToken });
    expect(check!.status).toBe("outdated");
    // The same digest path as a person's change: one mail once the lab has been quiet.
    expect(await deliverDigest({ labId: team.lab.id, quietSeconds: 0 })).toBe("digest");
    const mails = await mailTo(team.people.manager.email);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toContain("Procedure room T");

    const [row] = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, team.lab.id), like(auditEvents.action, "stock.%")))
      .orderBy(desc(auditEvents.id));
    expect(row).toMatchObject({ action: "stock.balloon.update", actorUserId: null, actorTokenId: rw.id });
    const page = await listAuditEvents({ labId: team.lab.id });
    expect(page.events.find((e) => e.id === row!.id)?.actorName).toBe("token Pharmacy feed");
    const [used] = await db.select().from(labTokens).where(eq(labTokens.id, rw.id));
    expect(used!.lastUsedAt).not.toBeNull();
  });

  it("never writes the token or its hash into the audit log", async () => {
    const [row] = await db.select({ hash: labTokens.tokenHash }).from(labTokens).where(eq(labTokens.id, rw.id));
    const leaks = await db
      .select({ id: auditEvents.id })
      .from(auditEvents)
      .where(
        sql`${auditEvents.detail} LIKE ${`%${rw.token.slice(4)}%`} OR ${auditEvents.detail} LIKE ${`%${row!.hash}%`}`,
      );
    expect(leaks).toEqual([]);
  });

  it("imports a balloon CSV (multipart) with stock:write, audited under the token's name", async () => {
    const body = new FormData();
    body.set(
      "file",
      new File(
        ["family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm\nSC token import,sc,2.50,yes,8,14\n"],
        "s.csv",
        {
          type: "text/csv",
        },
      ),
    );
    const res = await importRoute(
      new Request(`${env.APP_URL}/api/v1/labs/${team.lab.slug}/stock/import`, {
        method: "POST",
        headers: { authorization: `Bearer ${rw.token}` },
        body,
      }),
      { params: Promise.resolve({ slug: team.lab.slug }) },
    );
    expect(res.status).toBe(200);
    expect(((await res.json()) as { applied: boolean }).applied).toBe(true);
    const [fam] = await db
      .select()
      .from(balloonFamilies)
      .where(and(eq(balloonFamilies.labId, team.lab.id), eq(balloonFamilies.name, "SC token import")));
    expect(fam).toBeDefined();
    const [row] = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.labId, team.lab.id), eq(auditEvents.action, "stock.import")));
    expect(row?.actorTokenId).toBe(rw.id);
  });

  it("is refused on another lab with 404, and nothing changes there", async () => {
    const before = { rev: await revision(team.other.id), audits: await auditCount(team.other.id) };
    expect((await send<TokenAnswer>(stockRoute, { slug: team.other.slug }, { bearer: rw.token })).status).toBe(404);
    const res = await send<TokenAnswer>(
      balloonRoute,
      { slug: team.other.slug, id: String(ids.otherBalloon) },
      { method: "PATCH", body: { inStock: false }, bearer: rw.token },
    );
    expect(res.status).toBe(404);
    // Its own lab's slug with the other lab's balloon id: that balloon is not found either.
    const cross = await send<TokenAnswer>(
      balloonRoute,
      { slug: team.lab.slug, id: String(ids.otherBalloon) },
      { method: "PATCH", body: { inStock: false }, bearer: rw.token },
    );
    expect(cross.status).toBe(404);
    expect(await revision(team.other.id)).toBe(before.rev);
    expect(await auditCount(team.other.id)).toBe(before.audits);
    expect((await db.select().from(balloons).where(eq(balloons.id, ids.otherBalloon)))[0]!.inStock).toBe(true);
  });

  it("is refused on every route that is not stock with 403, and nothing changes", async () => {
    const before = { rev: await revision(team.lab.id), audits: await auditCount(team.lab.id) };
    const slug = { slug: team.lab.slug };
    const tries = [
      await send<TokenAnswer>(membersRoute, slug, { bearer: rw.token }),
      await send<TokenAnswer>(chartsRoute, slug, { bearer: rw.token }),
      await send<TokenAnswer>(rulesRoute, slug, { method: "PUT", body: { reviewPeriodMonths: 6 }, bearer: rw.token }),
      await send<TokenAnswer>(settingsRoute, slug, {
        method: "PATCH",
        body: { timeZone: "Asia/Tokyo" },
        bearer: rw.token,
      }),
      await send<TokenAnswer>(createTokenRoute, slug, {
        method: "POST",
        body: { name: "child", scopes: ["stock:read"] },
        bearer: rw.token,
      }),
      await send<TokenAnswer>(listTokensRoute, slug, { bearer: rw.token }),
      await send<TokenAnswer>(solveRoute, {}, { bearer: rw.token, path: "/api/v1/solve?law=murray&d1=3&d2=2.5" }),
    ];
    expect(tries.map((t) => t.status)).toEqual(tries.map(() => 403));
    expect(tries[0]!.json.error.message).toMatch(/stock routes/);
    expect(await revision(team.lab.id)).toBe(before.rev);
    expect(await auditCount(team.lab.id)).toBe(before.audits);
    const [lab] = await db.select().from(labs).where(eq(labs.id, team.lab.id));
    expect(lab!.timeZone).toBe("UTC");
  });

  it("needs the exact JSON content type (415) but no Origin", async () => {
    const b = await balloonAt(team.lab.id, 2.5);
    const res = await send<TokenAnswer>(
      balloonRoute,
      { slug: team.lab.slug, id: String(b.id) },
      { method: "PATCH", body: { inStock: false }, bearer: rw.token, contentType: "text/plain" },
    );
    expect(res.status).toBe(415);
    expect((await balloonAt(team.lab.id, 2.5)).inStock).toBe(true);
  });

  it("without stock:write a token reads but cannot change (403), and nothing changes", async () => {
    const ro = await newToken("Read-only dashboard", ["stock:read"]);
    as(null);
    expect((await send<TokenAnswer>(stockRoute, { slug: team.lab.slug }, { bearer: ro.token })).status).toBe(200);
    const before = await revision(team.lab.id);
    const b = await balloonAt(team.lab.id, 2.75);
    const res = await send<TokenAnswer>(
      balloonRoute,
      { slug: team.lab.slug, id: String(b.id) },
      { method: "PATCH", body: { inStock: false }, bearer: ro.token },
    );
    expect(res.status).toBe(403);
    expect(res.json.error.message).toMatch(/stock:write/);
    expect(await revision(team.lab.id)).toBe(before);
    // And a write-only token cannot read.
    const wo = await newToken("Write-only feed", ["stock:write"]);
    as(null);
    expect((await send<TokenAnswer>(stockRoute, { slug: team.lab.slug }, { bearer: wo.token })).status).toBe(403);
  });

  it("unknown, malformed and revoked tokens answer 401 with a Bearer challenge", async () => {
    const unknown = await send<TokenAnswer>(stockRoute, { slug: team.lab.slug }, { bearer: `fwt_${"A".repeat(43)}` });
    expect(unknown.status).toBe(401);
    expect(unknown.headers.get("www-authenticate")).toMatch(/^Bearer/);
    expect((await send<TokenAnswer>(stockRoute, { slug: team.lab.slug }, { bearer: "not-a-token" })).status).toBe(401);

    const doomed = await newToken("Old feed", ["stock:read", "stock:write"]);
    as(team.people.operator);
    expect(
      (await send<TokenAnswer>(revokeTokenRoute, { slug: team.lab.slug, id: String(doomed.id) }, { method: "DELETE" }))
        .status,
    ).toBe(403);
    as(team.people.manager);
    const revoked = await send<TokenAnswer>(
      revokeTokenRoute,
      { slug: team.lab.slug, id: String(doomed.id) },
      { method: "DELETE" },
    );
    expect(revoked.status).toBe(200);
    expect(
      (await send<TokenAnswer>(revokeTokenRoute, { slug: team.lab.slug, id: String(doomed.id) }, { method: "DELETE" }))
        .status,
    ).toBe(404);
    as(null);
    const before = await revision(team.lab.id);
    const b = await balloonAt(team.lab.id, 3);
    const res = await send<TokenAnswer>(
      balloonRoute,
      { slug: team.lab.slug, id: String(b.id) },
      { method: "PATCH", body: { inStock: false }, bearer: doomed.token },
    );
    expect(res.status).toBe(401);
    expect(res.headers.get("www-authenticate")).toMatch(/^Bearer/);
    expect(await revision(team.lab.id)).toBe(before);
    // Gone from the list; the audit log keeps its name.
    as(team.people.manager);
    const list = await send<TokenAnswer>(listTokensRoute, { slug: team.lab.slug });
    expect(list.json.tokens.map((t) => t.id)).not.toContain(doomed.id);
    const page = await listAuditEvents({ labId: team.lab.id });
    expect(page.events.find((e) => e.action === "lab.token_revoked")?.detail).toEqual({ name: "Old feed" });
  });

  it(`allows ${LIMIT} requests a minute per token, then 429 with Retry-After; other tokens are unaffected`, async () => {
    const busy = await newToken("Busy feed", ["stock:read"]);
    as(null);
    const statuses: number[] = [];
    let retryAfter: string | null = null;
    for (let i = 0; i < LIMIT + 2; i++) {
      const res = await send<TokenAnswer>(stockRoute, { slug: team.lab.slug }, { bearer: busy.token });
      statuses.push(res.status);
      if (res.status === 429) retryAfter = res.headers.get("retry-after");
    }
    expect(statuses.slice(0, LIMIT)).toEqual(Array(LIMIT).fill(200));
    expect(statuses.slice(LIMIT)).toEqual([429, 429]);
    expect(Number(retryAfter)).toBeGreaterThan(0);
    expect((await send<TokenAnswer>(stockRoute, { slug: team.lab.slug }, { bearer: rw.token })).status).toBe(200);
  });
});
