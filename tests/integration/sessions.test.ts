// Finding 4: a cookie taken before a password reset, a sign-out or removal from a lab must
// stop working. Cookies carry users.session_version; the session reader compares it.
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { completePasswordReset, createPasswordReset } from "@/db/queries/password-resets";
import { accountWrite } from "@/lib/ops/write";
import { removeMember } from "./support/writes";
import { findSessionUser, findSessionVersion, signOutEverywhere } from "@/db/queries/sessions";
import { auditEvents } from "@/db/schema";
import { verifySignIn } from "@/lib/auth/sign-in";
import { createSignInThrottle } from "@/lib/auth/throttle";
import { databaseName } from "@/lib/auth/sign-in";
import { env } from "@/lib/env";
import { hashToken } from "@/lib/auth/tokens";
import { createUser, FIXTURE_PASSWORD, labWithTeam } from "./support/fixtures";

afterAll(() => pool.end());

const throttle = () =>
  createSignInThrottle({
    pool: pool.pool,
    dbName: databaseName(env.DATABASE_URL),
    maxFailsPerAccount: 5,
    maxFailsPerIp: 1000,
    windowSeconds: 60,
  });

async function signedIn(email: string) {
  const r = await verifySignIn({ email, password: FIXTURE_PASSWORD, ip: "192.0.2.50", throttle: throttle() });
  if (!r.ok) throw new Error("sign-in failed");
  return r.user;
}

describe("session versions", () => {
  it("sign-in hands out the current version, and the session reader accepts only that one", async () => {
    const u = await createUser("sv");
    const s = await signedIn(u.email);
    expect(s.sessionVersion).toBe(0);
    expect(await findSessionUser({ id: u.id, sessionVersion: 0 })).toEqual({ id: u.id, email: u.email, name: u.name });
    expect(await findSessionUser({ id: u.id, sessionVersion: 1 })).toBeNull();
  });

  it("a password reset ends every older session", async () => {
    const u = await createUser("sv-reset");
    const before = (await signedIn(u.email)).sessionVersion;
    const token = "t".repeat(43) + u.id;
    await accountWrite((tx) =>
      createPasswordReset(tx, {
        userId: u.id,
        tokenHash: hashToken(token),
        expiresAt: new Date(Date.now() + 3600_000),
      }),
    );
    await accountWrite((tx) =>
      completePasswordReset(tx, { tokenHash: hashToken(token), passwordHash: "$2b$11$" + "x".repeat(53) }),
    );
    expect(await findSessionUser({ id: u.id, sessionVersion: before })).toBeNull();
    expect(await findSessionVersion({ userId: u.id })).toBe(before + 1);
  });

  it("signing out ends the person's sessions everywhere and is audited", async () => {
    const u = await createUser("sv-out");
    const before = (await signedIn(u.email)).sessionVersion;
    await signOutEverywhere({ userId: u.id });
    expect(await findSessionUser({ id: u.id, sessionVersion: before })).toBeNull();
    const after = await signedIn(u.email);
    expect(after.sessionVersion).toBe(before + 1);
    expect(await findSessionUser({ id: u.id, sessionVersion: after.sessionVersion })).not.toBeNull();
    const rows = await db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.targetId, String(u.id)));
    expect(rows.map((r) => r.action)).toContain("signout");
  });

  it("removal from a lab ends the removed person's sessions, not the remover's", async () => {
    const { lab, people } = await labWithTeam();
    const op = await signedIn(people.operator.email);
    const mgr = await signedIn(people.manager.email);
    await removeMember({ labId: lab.id, membershipId: people.operator.membershipId, actorUserId: people.manager.id });
    expect(await findSessionUser({ id: op.id, sessionVersion: op.sessionVersion })).toBeNull();
    expect(await findSessionUser({ id: mgr.id, sessionVersion: mgr.sessionVersion })).not.toBeNull();
  });
});
