// Sign-up, e-mail confirmation and their limits, on the real MariaDB and the local mail fake.
import { randomBytes } from "node:crypto";
import { count, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { emailVerifications, invitations, labs, rateLimits, users } from "@/db/schema";
import { hashToken, newToken } from "@/lib/auth/tokens";
import { acceptInvitationAsMember } from "@/lib/ops/accounts";
import { env } from "@/lib/env";
import { createLab } from "@/lib/ops/lab-create";
import { admitSignUp, completeSignUp, resendVerification, signUp, verifyEmail } from "@/lib/ops/sign-up";
import { createLab as createFixtureLab, createUser, unique } from "./support/fixtures";
import { as } from "../support/roles";
import { linkIn, mailTo } from "../support/mail";
import { refusal } from "../support/refusal";

afterAll(() => pool.end());

const email = (prefix = "signup") => `${unique(prefix)}@example.test`;
const ip = () => `203.0.113.${randomBytes(1)[0]}-${unique("ip")}`;
const PASSWORD = "a long enough phrase";

const userRow = async (address: string) => (await db.select().from(users).where(eq(users.email, address)))[0];
const userCount = async () => Number((await db.select({ n: count() }).from(users))[0]!.n);

describe("sign-up", () => {
  it("creates an unverified account and mails a single-use link stored only as its hash", async () => {
    const address = email();
    expect(await signUp({ name: "Dr Sam Okoro", email: address.toUpperCase(), password: PASSWORD }, { ip: ip() })).toBe(
      "created",
    );
    const user = await userRow(address);
    expect(user).toBeDefined();
    expect(user!.emailVerifiedAt).toBeNull();
    expect(user!.passwordHash).not.toContain(PASSWORD);

    const [mail] = await mailTo(address);
    expect(mail?.subject).toBe("Confirm your e-mail address for Forkwall");
    const token = linkIn(mail!.text, "verify-email").token;
    const [link] = await db.select().from(emailVerifications).where(eq(emailVerifications.userId, user!.id));
    expect(link!.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(link)).not.toContain(token);
    const ttl = link!.expiresAt.getTime() - Date.now();
    expect(ttl).toBeGreaterThan(23 * 3600_000);
    expect(ttl).toBeLessThanOrEqual(24 * 3600_000);

    // Unverified: no lab can be created.
    const refused = await refusal(createLab(as(user!), { name: "Too early lab", slug: unique("early") }));
    expect(refused.status).toBe(403);
    expect(refused.message).toMatch(/Confirm your e-mail/);

    const done = await verifyEmail({ token });
    expect(done).toMatchObject({ userId: user!.id, email: address, changedFrom: null });
    expect((await userRow(address))!.emailVerifiedAt).toBeInstanceOf(Date);

    // Single use.
    expect((await refusal(verifyEmail({ token }))).status).toBe(409);
    // Now a lab can be created.
    const slug = unique("verified");
    expect(await createLab(as(user!), { name: "Verified lab (illustrative)", slug })).toMatchObject({
      lab: { slug },
      role: "manager",
    });
  });

  it("answers an existing address the same way, changes nothing and mails 'you already have an account'", async () => {
    const existing = await createUser("existing");
    const before = await userRow(existing.email);
    const usersBefore = await userCount();
    // The admitted input is the same shape for both; the edges answer before the work is done.
    const admittedNew = await admitSignUp({ name: "New Person", email: email(), password: PASSWORD }, { ip: ip() });
    const admittedOld = await admitSignUp(
      { name: "Intruder", email: existing.email, password: PASSWORD },
      { ip: ip() },
    );
    expect(Object.keys(admittedNew).sort()).toEqual(Object.keys(admittedOld).sort());

    expect(await completeSignUp(admittedOld, { ip: ip() })).toBe("existing");
    expect(await userCount()).toBe(usersBefore);
    const after = await userRow(existing.email);
    expect(after).toEqual(before);
    const mails = await mailTo(existing.email);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toBe("You already have a Forkwall account");
    expect(mails[0]!.text).not.toMatch(/verify-email/);
    expect(await db.select().from(emailVerifications).where(eq(emailVerifications.userId, existing.id))).toEqual([]);
  });

  it("refuses bad fields with 400 naming each, and stores nothing", async () => {
    const usersBefore = await userCount();
    const err = await refusal(signUp({ name: "", email: "not an address", password: "short" }, { ip: ip() }));
    expect(err.status).toBe(400);
    expect(err.issues!.map((i) => i.path[0]).sort()).toEqual(["email", "name", "password"]);
    const extra = await refusal(
      signUp({ name: "Ok Name", email: email(), password: PASSWORD, admin: true }, { ip: ip() }),
    );
    expect(extra.status).toBe(400);
    expect(await userCount()).toBe(usersBefore);
  });

  it("refuses every sign-up with 403 when SIGNUP is invite-only", async () => {
    const address = email("closed");
    const was = env.SIGNUP;
    env.SIGNUP = "invite-only";
    try {
      const err = await refusal(signUp({ name: "Closed Door", email: address, password: PASSWORD }, { ip: ip() }));
      expect(err.status).toBe(403);
      expect(err.message).toMatch(/invitation-only/);
    } finally {
      env.SIGNUP = was;
    }
    expect(await userRow(address)).toBeUndefined();
    expect(await mailTo(address)).toEqual([]);
  });

  it("allows 10 sign-ups an hour from one client address, then 429 for any address (counted in MariaDB)", async () => {
    const from = ip();
    for (let i = 0; i < 10; i++)
      await admitSignUp({ name: "Flood Test", email: email("flood"), password: PASSWORD }, { ip: from });
    const address = email("flood-last");
    const err = await refusal(signUp({ name: "Flood Test", email: address, password: PASSWORD }, { ip: from }));
    expect(err.status).toBe(429);
    expect(await userRow(address)).toBeUndefined();
    const [row] = await db
      .select()
      .from(rateLimits)
      .where(eq(rateLimits.key, `signup-ip:${from}`));
    expect(row?.points).toBeGreaterThanOrEqual(11);
    // Another address is not held back.
    await admitSignUp({ name: "Flood Test", email: email("other"), password: PASSWORD }, { ip: ip() });
  });

  it("resends a fresh link (the old one stops working), at most 5 e-mails an hour", async () => {
    const address = email("resend");
    await signUp({ name: "Resend Person", email: address, password: PASSWORD }, { ip: ip() });
    const user = (await userRow(address))!;
    const first = linkIn((await mailTo(address))[0]!.text, "verify-email").token;
    const me = as({ id: user.id, email: user.email, name: user.name });
    for (let i = 0; i < 4; i++) expect(await resendVerification(me)).toEqual({ email: address });
    const mails = await mailTo(address);
    expect(mails).toHaveLength(5);
    const err = await refusal(resendVerification(me));
    expect(err.status).toBe(429);
    expect(await mailTo(address)).toHaveLength(5);
    expect((await refusal(verifyEmail({ token: first }))).status).toBe(409);
    await verifyEmail({ token: linkIn(mails[4]!.text, "verify-email").token });
    expect((await refusal(resendVerification(me))).status).toBe(409);
    expect((await refusal(resendVerification({ kind: "anonymous" }))).status).toBe(401);
  });

  it("an unconfirmed account that accepts an invitation to its address is confirmed by it", async () => {
    const address = email("invited");
    await signUp({ name: "Invited Later", email: address, password: PASSWORD }, { ip: ip() });
    const user = (await userRow(address))!;
    const lab = await createFixtureLab("invite-verifies");
    const { token, hash } = newToken();
    await db.insert(invitations).values({
      labId: lab.id,
      email: address,
      role: "educator",
      tokenHash: hash,
      invitedBy: null,
      expiresAt: new Date(Date.now() + 3600_000),
      lastSentAt: new Date(),
    });
    await acceptInvitationAsMember(as({ id: user.id, email: address, name: user.name }), { token });
    expect((await userRow(address))!.emailVerifiedAt).toBeInstanceOf(Date);
  });

  it("treats a mangled or unknown link as not found", async () => {
    expect((await refusal(verifyEmail({ token: "nope" }))).status).toBe(404);
    expect((await refusal(verifyEmail({ token: "A".repeat(43) }))).status).toBe(404);
  });

  it("counts existing and invited accounts as verified (migration default)", async () => {
    const u = await createUser("fixture");
    expect((await userRow(u.email))!.emailVerifiedAt).toBeInstanceOf(Date);
    const [demo] = await db
      .select({ at: users.emailVerifiedAt })
      .from(users)
      .innerJoin(labs, eq(labs.slug, "demo"))
      .where(eq(users.email, "manager@forkwall.test"));
    if (demo) expect(demo.at).toBeInstanceOf(Date);
  });
});
