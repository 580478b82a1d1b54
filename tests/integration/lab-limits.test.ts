// Limits on labs created per account and invitation mail per lab, counted in MariaDB's
// rate_limits (so every instance shares them), and lab names that cannot carry a link into mail.
import { count, eq, like } from "drizzle-orm";
import { afterAll, describe, expect, it, vi } from "vitest";
import { db, pool } from "@/db";
import { invitations, labs } from "@/db/schema";
import { POST as createLabRoute } from "@/app/api/v1/labs/route";
import { POST as inviteRoute } from "@/app/api/v1/labs/[slug]/invitations/route";
import { PATCH as settingsRoute } from "@/app/api/v1/labs/[slug]/settings/route";
import { createLabLimits, INVITATION_MAILS_PER_LAB_PER_HOUR, LABS_PER_ACCOUNT_PER_DAY } from "@/lib/auth/lab-limits";
import type { SessionUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { createLab } from "@/lib/ops/lab-create";
import { inviteMember, resendInvitation } from "@/lib/ops/members";
import { call } from "../support/routes";
import { addMember, createLab as fixtureLab, createUser, unique } from "./support/fixtures";
import { mailTo } from "../support/mail";

const session = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));

afterAll(() => pool.end());

type Person = { id: number; email: string; name: string };
const as = (u: Person) => ({ kind: "user" as const, user: u });
async function failure(p: Promise<unknown>): Promise<AppError> {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}
const labsNamed = async (prefix: string) =>
  Number(
    (
      await db
        .select({ n: count() })
        .from(labs)
        .where(like(labs.name, `${prefix}%`))
    )[0]!.n,
  );

describe("labs created per account", () => {
  it(`allows ${LABS_PER_ACCOUNT_PER_DAY} a day, then 429 with Retry-After; refused attempts do not count`, async () => {
    const me = await createUser("many-labs");
    const prefix = unique("Limit lab");
    // A 400 and a 409 before the limit leave every use for real labs.
    expect((await failure(createLab(as(me), { name: "x", slug: unique("bad") }))).status).toBe(400);
    const taken = (await createLab(as(await createUser("first")), { name: "Taken lab", slug: unique("taken") })).lab;
    expect((await failure(createLab(as(me), { name: `${prefix} taken`, slug: taken.slug }))).status).toBe(409);
    for (let i = 0; i < LABS_PER_ACCOUNT_PER_DAY; i++)
      await createLab(as(me), { name: `${prefix} ${i}`, slug: unique(`limit${i}`) });
    expect(await labsNamed(prefix)).toBe(LABS_PER_ACCOUNT_PER_DAY);

    const err = await failure(createLab(as(me), { name: `${prefix} over`, slug: unique("over") }));
    expect(err.status).toBe(429);
    expect(err.code).toBe("rate_limited");
    const retry = err.retryAfterSeconds;
    expect(retry).toBeGreaterThan(23 * 3600);
    expect(retry).toBeLessThanOrEqual(24 * 3600);
    expect(err.message).toMatch(/5 labs in the last day.*Try again in 24 hours/);

    session.user = me;
    const res = await call(createLabRoute, {}, "POST", { name: `${prefix} api`, slug: unique("api") });
    expect(res.status).toBe(429);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(23 * 3600);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
    expect(await labsNamed(prefix)).toBe(LABS_PER_ACCOUNT_PER_DAY);

    // Another instance (its own limiter objects) reads the same count from the database.
    const elsewhere = createLabLimits();
    const ran = vi.fn(async () => 1);
    expect((await failure(elsewhere.labCreation(me.id, ran))).status).toBe(429);
    expect(ran).not.toHaveBeenCalled();
    // Someone else is not affected.
    expect((await createLab(as(await createUser("fresh")), { name: `${prefix} b`, slug: unique("b") })).role).toBe(
      "manager",
    );
  });

  it("refuses a lab name carrying a link or an address with 400 naming name, on create and rename", async () => {
    const me = await createUser("spam-name");
    session.user = me;
    const before = await labsNamed("URGENT");
    const res = await call(createLabRoute, {}, "POST", {
      name: "URGENT: your hospital account is locked - visit http://evil.example/unlock",
      slug: unique("urgent"),
    });
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: { issues: { path: string[] }[] } };
    expect(body.error.issues.map((i) => i.path.join("."))).toEqual(["name"]);
    expect(await labsNamed("URGENT")).toBe(before);

    const { lab } = await createLab(as(me), { name: "Plain name (illustrative)", slug: unique("plain") });
    const rename = await call(settingsRoute, { slug: lab.slug }, "PATCH", { name: "Mail help@evil.example now" });
    expect(rename.status).toBe(400);
    const [row] = await db.select({ name: labs.name }).from(labs).where(eq(labs.slug, lab.slug));
    expect(row!.name).toBe("Plain name (illustrative)");
  });
});

describe("invitation mail per lab", () => {
  it(`allows ${INVITATION_MAILS_PER_LAB_PER_HOUR} invitations and resends an hour, then 429; other labs unaffected`, async () => {
    const lab = await fixtureLab("it-invites");
    const other = await fixtureLab("it-invites-other");
    const manager = await createUser("inviter");
    await addMember(lab.id, manager.id, "manager");
    await addMember(other.id, manager.id, "manager");
    const ref = { lab: lab.slug };
    const sent: number[] = [];
    for (let i = 0; i < 20; i++) {
      const email = `${unique("guest")}@example.test`;
      sent.push((await inviteMember(as(manager), ref, { email, role: "operator" })).invitation.id);
    }
    // A refused invitation (already open) gives its use back.
    const dup = (await db.select().from(invitations).where(eq(invitations.id, sent[0]!)))[0]!;
    expect((await failure(inviteMember(as(manager), ref, { email: dup.email, role: "operator" }))).status).toBe(409);
    for (let i = 0; i < 10; i++) await resendInvitation(as(manager), { ...ref, invitationId: sent[i % 2]! });

    const late = `${unique("late")}@example.test`;
    const err = await failure(inviteMember(as(manager), ref, { email: late, role: "educator" }));
    expect(err.status).toBe(429);
    expect(err.retryAfterSeconds).toBeGreaterThan(3000);
    expect(err.message).toMatch(/30 invitations and resends in the last hour/);
    expect((await failure(resendInvitation(as(manager), { ...ref, invitationId: sent[5]! }))).status).toBe(429);

    session.user = manager;
    const res = await call(inviteRoute, { slug: lab.slug }, "POST", { email: late, role: "educator" });
    expect(res.status).toBe(429);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(3000);

    // Nothing written or mailed past the limit.
    const rows = await db.select().from(invitations).where(eq(invitations.labId, lab.id));
    expect(rows).toHaveLength(20);
    expect(await mailTo(late)).toEqual([]);
    expect(await mailTo(dup.email)).toHaveLength(6);
    expect(await mailTo(rows.find((r) => r.id === sent[5])!.email)).toHaveLength(1);

    const ok = await inviteMember(as(manager), { lab: other.slug }, { email: late, role: "educator" });
    expect(ok.emailSent).toBe(true);
  });
});
