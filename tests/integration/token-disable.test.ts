// A machine token does not outlive its creator's place in the lab: removing them, lowering their
// role below manager or their leaving disables their tokens in the same write (audited); a
// disabled token answers 401 like a revoked one, and a manager re-issues it with a new secret.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, balloonFamilies, labTokens } from "@/db/schema";
import { GET as stockRoute } from "@/app/api/v1/labs/[slug]/stock/route";
import { POST as createTokenRoute } from "@/app/api/v1/labs/[slug]/tokens/route";
import { POST as reissueRoute } from "@/app/api/v1/labs/[slug]/tokens/[id]/reissue/route";
import { PATCH as memberRoute } from "@/app/api/v1/labs/[slug]/members/[id]/route";
import type { SessionUser } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { leaveLab } from "@/lib/ops/account-settings";
import { changeMemberRole, removeMember } from "@/lib/ops/members";
import { createToken, listTokens } from "@/lib/ops/tokens";
import { addMember, createUser, labWithTeam } from "./support/fixtures";

const session = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));

type Person = { id: number; email: string; name: string };
type Handler<P> = (req: Request, ctx: { params: Promise<P> }) => Promise<Response>;
let team: Awaited<ReturnType<typeof labWithTeam>>;
const userCaller = (u: Person) => ({ kind: "user" as const, user: u });

async function call<P>(handler: Handler<P>, params: P, opts: { method?: string; body?: unknown; bearer?: string }) {
  const headers: Record<string, string> = opts.bearer
    ? { authorization: `Bearer ${opts.bearer}` }
    : { origin: new URL(env.APP_URL).origin };
  if (opts.body !== undefined) headers["content-type"] = "application/json";
  const res = await handler(
    new Request(`${env.APP_URL}/api/v1/x`, {
      method: opts.method ?? "GET",
      headers,
      ...(opts.body === undefined ? {} : { body: JSON.stringify(opts.body) }),
    }),
    { params: Promise.resolve(params) },
  );
  return { status: res.status, headers: res.headers, json: (await res.json()) as Record<string, unknown> };
}

/** A second manager who creates a token through the API; returns them and the token. */
async function managerWithToken(name: string) {
  const person = await createUser("token-maker");
  const membershipId = await addMember(team.lab.id, person.id, "manager");
  session.user = person;
  const res = await call(
    createTokenRoute,
    { slug: team.lab.slug },
    { method: "POST", body: { name, scopes: ["stock:read"] } },
  );
  expect(res.status).toBe(201);
  const token = res.json as { id: number; token: string };
  expect((await call(stockRoute, { slug: team.lab.slug }, { bearer: token.token })).status).toBe(200);
  return { person, membershipId, token };
}

const tokenRow = async (id: number) => (await db.select().from(labTokens).where(eq(labTokens.id, id)))[0]!;
const auditFor = async (tokenId: number, action: string) =>
  db
    .select()
    .from(auditEvents)
    .where(
      and(
        eq(auditEvents.labId, team.lab.id),
        eq(auditEvents.action, action),
        eq(auditEvents.targetId, String(tokenId)),
      ),
    );

async function refused(bearer: string) {
  const res = await call(stockRoute, { slug: team.lab.slug }, { bearer });
  expect(res.status).toBe(401);
  expect(res.headers.get("www-authenticate")).toMatch(/^Bearer /);
}

beforeAll(async () => {
  team = await labWithTeam();
  await db
    .insert(balloonFamilies)
    .values({ labId: team.lab.id, name: "NC token family", compliance: "nc", nominalAtm: 12, rbpAtm: 20 });
});
afterAll(() => pool.end());

describe("a token outlives nobody", () => {
  it("removing its creator disables it in the same write, with an audit row; then 401", async () => {
    const { person, membershipId, token } = await managerWithToken("feed removed");
    await removeMember(userCaller(team.people.manager), { lab: team.lab.slug, membershipId });
    const row = await tokenRow(token.id);
    expect(row.disabledAt).not.toBeNull();
    expect(row.revokedAt).toBeNull();
    expect(row.disabledReason).toBe(`Its creator, ${person.name}, was removed from the lab.`);
    const [audit] = await auditFor(token.id, "lab.token_disabled");
    expect(audit?.actorUserId).toBe(team.people.manager.id);
    expect(audit?.detail).toEqual({ name: "feed removed", reason: row.disabledReason });
    await refused(token.token);
  });

  it("lowering its creator below manager disables it (through the route); a manager keeps theirs", async () => {
    const { membershipId, token } = await managerWithToken("feed demoted");
    const kept = await managerWithToken("feed kept");
    session.user = team.people.manager;
    const res = await call(
      memberRoute,
      { slug: team.lab.slug, id: String(membershipId) },
      { method: "PATCH", body: { role: "educator" } },
    );
    expect(res.status).toBe(200);
    expect((await tokenRow(token.id)).disabledReason).toMatch(/is no longer a manager \(now educator\)/);
    await refused(token.token);
    // A change that keeps the role where tokens are managed touches nothing.
    await changeMemberRole(
      userCaller(team.people.manager),
      { lab: team.lab.slug, membershipId: kept.membershipId },
      {
        role: "manager",
      },
    );
    expect((await tokenRow(kept.token.id)).disabledAt).toBeNull();
    expect((await call(stockRoute, { slug: team.lab.slug }, { bearer: kept.token.token })).status).toBe(200);
  });

  it("leaving the lab disables the leaver's tokens", async () => {
    const { person, token } = await managerWithToken("feed left");
    await leaveLab(userCaller(person), { lab: team.lab.slug });
    expect((await tokenRow(token.id)).disabledReason).toBe(`Its creator, ${person.name}, left the lab.`);
    await refused(token.token);
  });

  it("the tokens list shows a disabled token and why; a manager re-issues it: same name and scopes, new secret once", async () => {
    const { membershipId, token } = await managerWithToken("feed reissued");
    await removeMember(userCaller(team.people.manager), { lab: team.lab.slug, membershipId });
    const listed = (await listTokens(userCaller(team.people.manager), { lab: team.lab.slug })).tokens;
    const shown = listed.find((t) => t.id === token.id)!;
    expect(shown.disabledAt).toBeInstanceOf(Date);
    expect(shown.disabledReason).toMatch(/was removed from the lab/);

    session.user = team.people.educator;
    expect((await call(reissueRoute, { slug: team.lab.slug, id: String(token.id) }, { method: "POST" })).status).toBe(
      403,
    );
    session.user = team.people.manager;
    const res = await call(reissueRoute, { slug: team.lab.slug, id: String(token.id) }, { method: "POST" });
    expect(res.status).toBe(201);
    const issued = res.json as { id: number; name: string; scopes: string[]; token: string; disabledAt: null };
    expect(issued).toMatchObject({ name: "feed reissued", scopes: ["stock:read"], disabledAt: null });
    expect(issued.token).toMatch(/^fwt_/);
    expect(issued.token).not.toBe(token.token);
    expect((await call(stockRoute, { slug: team.lab.slug }, { bearer: issued.token })).status).toBe(200);
    await refused(token.token);
    expect((await tokenRow(token.id)).revokedAt).not.toBeNull();
    expect((await tokenRow(issued.id)).createdBy).toBe(team.people.manager.id);
    const [audit] = await auditFor(issued.id, "lab.token_reissued");
    expect(audit?.detail).toEqual({ name: "feed reissued", scopes: ["stock:read"], replaces: token.id });
    // The old row is gone from the list; the new one is listed active.
    const after = (await listTokens(userCaller(team.people.manager), { lab: team.lab.slug })).tokens;
    expect(after.some((t) => t.id === token.id)).toBe(false);
    expect(after.find((t) => t.id === issued.id)?.disabledAt).toBeNull();

    // An active token is not re-issued (409); the old id is now revoked (404).
    const again = await call(reissueRoute, { slug: team.lab.slug, id: String(issued.id) }, { method: "POST" });
    expect(again.status).toBe(409);
    expect((await call(reissueRoute, { slug: team.lab.slug, id: String(token.id) }, { method: "POST" })).status).toBe(
      404,
    );
  });

  it("a refused removal (the last manager) disables nothing", async () => {
    const solo = await labWithTeam();
    const mine = await createToken(
      userCaller(solo.people.manager),
      { lab: solo.lab.slug },
      { name: "sole manager's feed", scopes: ["stock:read"] },
    );
    const err = await removeMember(userCaller(solo.people.manager), {
      lab: solo.lab.slug,
      membershipId: solo.people.manager.membershipId,
    }).then(
      () => null,
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(409);
    expect((await tokenRow(mine.id)).disabledAt).toBeNull();
  });
});
