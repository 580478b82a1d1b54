// A pending e-mail change link dies with a password change, a password reset and an e-mail
// change: whoever asked for it with the old password cannot move the account afterwards.
import { and, eq, isNotNull } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { emailVerifications, users } from "@/db/schema";
import { newToken } from "@/lib/auth/tokens";
import { AppError } from "@/lib/errors";
import { changePassword, readAccount, requestEmailChange } from "@/lib/ops/account-settings";
import { requestPasswordReset, resetPassword } from "@/lib/ops/accounts";
import { readVerificationLink, verifyEmail } from "@/lib/ops/sign-up";
import { createUser, FIXTURE_PASSWORD, unique } from "./support/fixtures";
import { linkIn, mailTo } from "../support/mail";

afterAll(() => pool.end());

type Person = { id: number; email: string; name: string };
const as = (u: Person) => ({ kind: "user" as const, user: u });
const newAddress = () => `${unique("moved")}@example.test`;
const emailOf = async (id: number) => (await db.select().from(users).where(eq(users.id, id)))[0]!.email;

/** Asks to move `me` to a new address and returns the link's token from the mail sent there. */
async function pendingChange(me: Person) {
  const target = newAddress();
  await requestEmailChange(as(me), { email: target, currentPassword: FIXTURE_PASSWORD });
  const [mail] = await mailTo(target);
  return { target, token: mail!.text.match(/verify-email\/([A-Za-z0-9_-]{43})/)![1]! };
}

async function refusedLink(me: Person, token: string) {
  const err = await verifyEmail({ token }).then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  expect((err as AppError).status).toBe(409);
  expect((err as AppError).message).toMatch(/no longer valid/);
  expect(await emailOf(me.id)).toBe(me.email);
  expect((await readVerificationLink({ token }))?.state).toBe("revoked");
}

describe("e-mail change links are revoked", () => {
  it("by a password change", async () => {
    const me = await createUser("pw-change");
    const { token } = await pendingChange(me);
    expect((await readAccount(as(me))).pendingEmail).not.toBeNull();
    await changePassword(as(me), {
      currentPassword: FIXTURE_PASSWORD,
      password: "another-password-2026",
      confirm: "another-password-2026",
    });
    expect((await readAccount(as(me))).pendingEmail).toBeNull();
    await refusedLink(me, token);
  });

  it("by a password reset", async () => {
    const me = await createUser("pw-reset");
    const { token } = await pendingChange(me);
    expect(await requestPasswordReset({ email: me.email })).toBe("sent");
    const reset = linkIn((await mailTo(me.email)).at(-1)!.text, "reset-password").token;
    await resetPassword({ token: reset, password: "another-password-2026" });
    await refusedLink(me, token);
  });

  it("by an e-mail change, for every other open change link", async () => {
    const me = await createUser("mover");
    const { target, token } = await pendingChange(me);
    // A second open change link (as a request racing the first would leave).
    const other = newToken();
    await db.insert(emailVerifications).values({
      userId: me.id,
      email: newAddress(),
      tokenHash: other.hash,
      expiresAt: new Date(Date.now() + 3600_000),
    });
    expect(await verifyEmail({ token })).toMatchObject({ email: target, changedFrom: me.email });
    const moved = { ...me, email: target };
    await refusedLink(moved, other.token);
    const revoked = await db
      .select()
      .from(emailVerifications)
      .where(and(eq(emailVerifications.userId, me.id), isNotNull(emailVerifications.revokedAt)));
    expect(revoked).toHaveLength(1);
  });

  it("a password change leaves a link of another account alone", async () => {
    const me = await createUser("pw-mine");
    const them = await createUser("pw-theirs");
    const theirs = await pendingChange(them);
    await changePassword(as(me), {
      currentPassword: FIXTURE_PASSWORD,
      password: "another-password-2026",
      confirm: "another-password-2026",
    });
    expect(await verifyEmail({ token: theirs.token })).toMatchObject({ email: theirs.target });
  });
});
