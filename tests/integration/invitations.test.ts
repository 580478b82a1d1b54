import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { findInvitationByTokenHash, listOpenInvitations } from "@/db/queries/invitations";
import { auditEvents, invitations, memberships, users } from "@/db/schema";
import type { Member } from "@/lib/ops/access";
import { inviteMember as inviteOp, resendInvitation as resendOp } from "@/lib/ops/members";
import { hashToken } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";
import { createUser, labWithTeam, unique } from "./support/fixtures";
import { linkIn, mailTo } from "../support/mail";
import { acceptInvitation as acceptRow, revokeInvitation as revokeRow } from "./support/writes";

const asCaller = (m: Member) => ({ kind: "user" as const, user: m.user });
const inviteMember = (m: Member, input: { email: string; role: string }) =>
  inviteOp(asCaller(m), { lab: m.lab.slug }, input);
const resendInvitation = (m: Member, invitationId: number) => resendOp(asCaller(m), { lab: m.lab.slug, invitationId });

let team: Awaited<ReturnType<typeof labWithTeam>>;
let manager: Member;

beforeAll(async () => {
  team = await labWithTeam();
  manager = {
    user: { id: team.people.manager.id, email: team.people.manager.email, name: team.people.manager.name },
    lab: { ...team.lab, stockRevision: 0, isDemo: false, timeZone: "UTC", numberFormat: "point", contactLine: null },
    role: "manager",
  };
});
afterAll(() => pool.end());

const auditFor = (labId: number, action: string) =>
  db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.labId, labId), eq(auditEvents.action, action)));
const rejects = async (p: Promise<unknown>, status: number, message: RegExp) => {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  expect((err as AppError).status).toBe(status);
  expect((err as AppError).message).toMatch(message);
};

describe("invitations", () => {
  it("e-mails a single-use link whose token is stored only as its SHA-256 hash, expiring in 72 h", async () => {
    const email = `${unique("invitee")}@example.test`;
    const t0 = Date.now();
    const { invitation, emailSent } = await inviteMember(manager, { email, role: "educator" });
    expect(emailSent).toBe(true);

    const [mail] = await mailTo(email);
    expect(mail?.subject).toContain(team.lab.name);
    const { token, url } = linkIn(mail!.text, "invite");
    expect(url.startsWith(`${process.env.APP_URL ?? "http://localhost"}`)).toBe(true);

    const [row] = await db.select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row!.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    const ttl = row!.expiresAt.getTime() - t0;
    expect(ttl).toBeGreaterThan(72 * 3600_000 - 60_000);
    expect(ttl).toBeLessThanOrEqual(72 * 3600_000 + 60_000);

    const [sent] = await auditFor(team.lab.id, "invitation.sent").then((r) =>
      r.filter((e) => e.targetId === String(invitation.id)),
    );
    expect(sent?.actorUserId).toBe(team.people.manager.id);
    expect(sent?.detail).toEqual({ email, role: "educator" });

    // Accept: a new account joins with the invited role, and the link is spent.
    const joined = await acceptRow({
      tokenHash: hashToken(token),
      newAccount: { name: "New Educator", passwordHash: "x".repeat(60) },
    });
    expect(joined.role).toBe("educator");
    const [m] = await db
      .select()
      .from(memberships)
      .where(and(eq(memberships.labId, team.lab.id), eq(memberships.userId, joined.userId)));
    expect(m?.role).toBe("educator");
    expect((await findInvitationByTokenHash({ tokenHash: hashToken(token) }))?.state).toBe("used");
    expect(
      (await auditFor(team.lab.id, "invitation.accepted")).some(
        (e) => e.targetId === String(invitation.id) && e.actorUserId === joined.userId,
      ),
    ).toBe(true);

    await rejects(
      acceptRow({ tokenHash: hashToken(token), newAccount: { name: "Again", passwordHash: "y".repeat(60) } }),
      409,
      /already been used/,
    );
    expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });

  it("refuses an expired link and changes nothing", async () => {
    const email = `${unique("late")}@example.test`;
    const { invitation } = await inviteMember(manager, { email, role: "operator" });
    const { token } = linkIn((await mailTo(email))[0]!.text, "invite");
    await db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.id, invitation.id));
    await rejects(
      acceptRow({ tokenHash: hashToken(token), newAccount: { name: "Late", passwordHash: "x".repeat(60) } }),
      409,
      /expired/,
    );
    expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
    expect((await listOpenInvitations({ labId: team.lab.id })).find((i) => i.id === invitation.id)?.status).toBe(
      "expired",
    );
  });

  it("resend issues a new token and e-mail; the old link stops working; revoke ends it", async () => {
    const email = `${unique("again")}@example.test`;
    const { invitation } = await inviteMember(manager, { email, role: "lead" });
    const first = linkIn((await mailTo(email))[0]!.text, "invite").token;
    await resendInvitation(manager, invitation.id);
    const mails = await mailTo(email);
    expect(mails).toHaveLength(2);
    const second = linkIn(mails[1]!.text, "invite").token;
    expect(second).not.toBe(first);
    expect(await findInvitationByTokenHash({ tokenHash: hashToken(first) })).toBeNull();
    expect((await findInvitationByTokenHash({ tokenHash: hashToken(second) }))?.state).toBe("valid");
    expect((await auditFor(team.lab.id, "invitation.resent")).some((e) => e.targetId === String(invitation.id))).toBe(
      true,
    );

    await revokeRow({ labId: team.lab.id, invitationId: invitation.id, actorUserId: manager.user.id });
    await rejects(
      acceptRow({ tokenHash: hashToken(second), newAccount: { name: "Nope", passwordHash: "x".repeat(60) } }),
      409,
      /withdrawn/,
    );
    expect((await auditFor(team.lab.id, "invitation.revoked")).some((e) => e.targetId === String(invitation.id))).toBe(
      true,
    );
    await rejects(resendInvitation(manager, invitation.id), 409, /revoked/);
  });

  it("an existing account joins with the invited role after signing in; another account cannot use the link", async () => {
    const existing = await createUser("existing");
    const stranger = await createUser("stranger");
    await inviteMember(manager, { email: existing.email, role: "operator" });
    const { token } = linkIn((await mailTo(existing.email))[0]!.text, "invite");
    expect((await findInvitationByTokenHash({ tokenHash: hashToken(token) }))?.hasAccount).toBe(true);
    await rejects(
      acceptRow({ tokenHash: hashToken(token), newAccount: { name: "Twin", passwordHash: "x".repeat(60) } }),
      409,
      /already uses/,
    );
    await rejects(acceptRow({ tokenHash: hashToken(token), userId: stranger.id }), 403, /is for/);
    const joined = await acceptRow({ tokenHash: hashToken(token), userId: existing.id });
    expect(joined).toMatchObject({ userId: existing.id, role: "operator", alreadyMember: false });
  });

  it("refuses to invite a member or an address already invited, lab by lab", async () => {
    await rejects(inviteMember(manager, { email: team.people.lead.email, role: "lead" }), 409, /already a member/);
    const email = `${unique("twice")}@example.test`;
    await inviteMember(manager, { email, role: "operator" });
    await rejects(inviteMember(manager, { email, role: "lead" }), 409, /already open/);
    // Another lab's manager acting on this lab's invitation: not found through their lab.
    const [inv] = await db
      .select()
      .from(invitations)
      .where(and(eq(invitations.labId, team.lab.id), eq(invitations.email, email)));
    await rejects(
      revokeRow({ labId: team.other.id, invitationId: inv!.id, actorUserId: team.people.outsider.id }),
      404,
      /not found/,
    );
  });

  it("single use holds under a race: two accepts at once, one account", async () => {
    const email = `${unique("race")}@example.test`;
    await inviteMember(manager, { email, role: "operator" });
    const { token } = linkIn((await mailTo(email))[0]!.text, "invite");
    const results = await Promise.allSettled(
      [1, 2, 3].map((i) =>
        acceptRow({
          tokenHash: hashToken(token),
          newAccount: { name: `Racer ${i}`, passwordHash: "x".repeat(60) },
        }),
      ),
    );
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(await db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
  });
});
