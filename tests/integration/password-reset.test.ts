import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { auditEvents, passwordResets, users } from "@/db/schema";
import { verifyPassword } from "@/lib/auth/password";
import { requestPasswordReset, resetPassword } from "@/lib/ops/accounts";
import { hashToken } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";
import { createUser, FIXTURE_PASSWORD, unique } from "./support/fixtures";
import { linkIn, mailTo } from "../support/mail";

afterAll(() => pool.end());

const failure = (p: Promise<unknown>) =>
  p.then(
    () => null,
    (e: unknown) => e as AppError,
  );
const hashOf = async (id: number) =>
  (await db.select({ h: users.passwordHash }).from(users).where(eq(users.id, id)))[0]!.h;

describe("password reset by e-mail", () => {
  it("sends nothing for an unknown address", async () => {
    const email = `${unique("nobody")}@example.test`;
    expect(await requestPasswordReset({ email })).toBe("no-account");
    expect(await mailTo(email)).toEqual([]);
  });

  it("e-mails a one-hour single-use link stored as a hash; using it sets the password and retires other links", async () => {
    const user = await createUser("forgetful");
    expect(await requestPasswordReset({ email: user.email })).toBe("sent");
    expect(await requestPasswordReset({ email: user.email })).toBe("sent");
    const mails = await mailTo(user.email);
    expect(mails).toHaveLength(2);
    const first = linkIn(mails[0]!.text, "reset-password").token;
    const second = linkIn(mails[1]!.text, "reset-password").token;

    const rows = await db.select().from(passwordResets).where(eq(passwordResets.userId, user.id));
    expect(rows.map((r) => r.tokenHash).sort()).toEqual([hashToken(first), hashToken(second)].sort());
    expect(JSON.stringify(rows)).not.toContain(first);
    for (const r of rows) expect(r.expiresAt.getTime() - r.createdAt.getTime()).toBeGreaterThan(59 * 60_000);

    await resetPassword({ token: second, password: "a brand new passphrase" });
    expect(await verifyPassword("a brand new passphrase", await hashOf(user.id))).toBe(true);
    expect(await verifyPassword(FIXTURE_PASSWORD, await hashOf(user.id))).toBe(false);

    const again = await failure(resetPassword({ token: second, password: "another passphrase" }));
    expect(again?.message).toMatch(/already been used/);
    const older = await failure(resetPassword({ token: first, password: "another passphrase" }));
    expect(older?.message).toMatch(/already been used/);
    expect(await verifyPassword("a brand new passphrase", await hashOf(user.id))).toBe(true);

    const events = await db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.targetId, String(user.id)));
    expect(events.map((e) => e.action)).toEqual(
      expect.arrayContaining(["password_reset.requested", "password_reset.completed"]),
    );
    expect(JSON.stringify(events)).not.toContain("a brand new passphrase");
  });

  it("refuses an expired link and keeps the old password", async () => {
    const user = await createUser("slow");
    await requestPasswordReset({ email: user.email });
    const { token } = linkIn((await mailTo(user.email))[0]!.text, "reset-password");
    await db
      .update(passwordResets)
      .set({ expiresAt: new Date(Date.now() - 1) })
      .where(eq(passwordResets.tokenHash, hashToken(token)));
    const err = await failure(resetPassword({ token: token, password: "too late passphrase" }));
    expect(err?.message).toMatch(/expired/);
    expect(await verifyPassword(FIXTURE_PASSWORD, await hashOf(user.id))).toBe(true);
  });

  it("sends at most five links per address per hour", async () => {
    const user = await createUser("flooded");
    const answers = [];
    for (let i = 0; i < 7; i++) answers.push(await requestPasswordReset({ email: user.email }));
    expect(answers).toEqual(["sent", "sent", "sent", "sent", "sent", "limited", "limited"]);
    expect(await mailTo(user.email)).toHaveLength(5);
  });
});
