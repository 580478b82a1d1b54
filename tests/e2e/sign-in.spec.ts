import { expect, test } from "@playwright/test";
import { postCredentials, signInPage } from "./support/auth";
import { closeDb, createPerson, expireThrottle, query, throttleKey, uniqueEmail } from "./support/db";
import { linkIn, mailTo, waitForMail } from "../support/mail";

test.afterAll(closeDb);

// Each test signs in from its own client address, so its failures count against no other test.
const address = () => `203.0.113.${Math.floor(Math.random() * 250) + 1}`;

test("wrong passwords and unknown addresses never sign in, and get the same answer", async ({ browser }) => {
  const person = await createPerson({ prefix: "wrong", password: "right-pass-2026" });
  const ctx = await browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": address() } });
  const page = await ctx.newPage();
  for (const [email, password] of [
    [person.email, "wrong-pass-2026"],
    [uniqueEmail("nobody"), "right-pass-2026"],
  ] as const) {
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password", { exact: true }).fill(password);
    await page.getByRole("button", { name: "Sign in", exact: true }).click();
    await expect(page.getByText("That e-mail address and password do not match an account.")).toBeVisible();
    await expect(page.getByLabel("E-mail")).toHaveValue(email);
    await expect(page.getByTestId("signed-in-as")).toHaveCount(0);
  }
  expect(await (await page.request.get("/api/auth/session")).json()).toBeNull();
  await ctx.close();
});

test("the throttle engages after five failures, refuses even the right password, and releases when its window ends", async ({
  browser,
}) => {
  const person = await createPerson({ prefix: "throttled", password: "right-pass-2026" });
  const ip = address();
  const ctx = await browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": ip } });
  const page = await ctx.newPage();
  const attempt = async (password: string) => {
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(person.email);
    await page.getByLabel("Password", { exact: true }).fill(password);
    const t0 = Date.now();
    await page.getByRole("button", { name: "Sign in", exact: true }).click();
    await expect(page.getByRole("alert").filter({ hasText: /do not match|Too many failed attempts/ })).toBeVisible();
    return {
      ms: Date.now() - t0,
      text:
        (await page
          .getByRole("alert")
          .filter({ hasText: /do not match|Too many/ })
          .textContent()) ?? "",
    };
  };

  const answers = [];
  for (let i = 0; i < 5; i++) answers.push(await attempt(`wrong-${i}-pass`));
  for (const a of answers) expect(a.text).toContain("do not match");
  // Slowed before refused: the fifth wrong answer is held about a second longer than the first two.
  expect(answers[4]!.ms - Math.min(answers[0]!.ms, answers[1]!.ms)).toBeGreaterThan(700);

  const refused = await attempt("right-pass-2026");
  expect(refused.text).toContain("Too many failed attempts");
  await expect(page.getByTestId("signed-in-as")).toHaveCount(0);
  // next-auth's own endpoint refuses too, from any address, for this account.
  expect(
    await postCredentials(ctx.request, person.email, "right-pass-2026", { "x-forwarded-for": address() }),
  ).toContain("code=throttled");
  await page.goto("/sign-in?error=CredentialsSignin&code=throttled");
  await expect(page.getByText(/Too many failed attempts/)).toBeVisible();

  // The window ends (moved into the past instead of waiting fifteen minutes).
  await expireThrottle(person.email);
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password", { exact: true }).fill("right-pass-2026");
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page.getByTestId("signed-in-as")).toHaveText(person.name);
  expect(await query("SELECT * FROM rate_limits WHERE `key` = ?", [throttleKey(person.email)])).toEqual([]);

  const audit = await query<{ action: string; detail: string | null }>(
    "SELECT action, detail FROM audit_events WHERE target_type = 'user' AND target_id = ? ORDER BY id",
    [String(person.id)],
  );
  expect(audit.map((a) => a.action)).toEqual([
    ...Array(5).fill("signin.failed"),
    "signin.refused",
    "signin.refused",
    "signin.succeeded",
  ]);
  expect(JSON.stringify(audit)).not.toMatch(/right-pass|wrong-\d/);
  await ctx.close();
});

test("forgotten password: the same answer for any address, a single-use link by e-mail, then the new password works", async ({
  page,
}) => {
  const person = await createPerson({ prefix: "forgot", password: "old-pass-2026" });
  const stranger = uniqueEmail("stranger");
  await page.goto("/sign-in");
  await page.getByRole("link", { name: "Forgot your password?" }).click();
  await expect(page.getByRole("heading", { name: "Reset your password" })).toBeVisible();
  for (const email of [stranger, person.email]) {
    await page.getByLabel("E-mail").fill(email);
    await page.getByRole("button", { name: "Send the link" }).click();
    await expect(
      page
        .getByRole("status")
        .filter({ hasText: `If an account uses ${email}, a link to choose a new password is on its way.` }),
    ).toBeVisible();
  }
  const link = linkIn((await waitForMail(person.email))[0]!, "reset-password").url;
  expect(await mailTo(stranger)).toEqual([]);

  await page.goto(link);
  await expect(page.getByText(person.email)).toBeVisible();
  await page.getByLabel("New password").fill("short");
  await page.getByLabel("Repeat the password").fill("short");
  await page.getByRole("button", { name: "Save the new password" }).click();
  await expect(page.getByText("Use at least 10 characters.")).toBeVisible();
  await page.getByLabel("New password").fill("new-pass-2026-long");
  await page.getByLabel("Repeat the password").fill("new-pass-2026-long");
  await page.getByRole("button", { name: "Save the new password" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Your password was changed." })).toBeVisible();

  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password", { exact: true }).fill("old-pass-2026");
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page.getByText("do not match")).toBeVisible();
  await signInPage(page, person.email, "new-pass-2026-long");

  await page.goto(link);
  await expect(page.getByText("already been used")).toBeVisible();
});

test("sign-out ends the session; lab pages then ask to sign in", async ({ page }) => {
  const person = await createPerson({ prefix: "leaver", password: "leaver-pass-2026", lab: "demo", role: "educator" });
  await signInPage(page, person.email, "leaver-pass-2026");
  await page.goto("/sign-out");
  await expect(page.getByText(`You are signed in as ${person.name}`)).toBeVisible();
  await page.getByRole("main").getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/sign-in\?signedOut=1/);
  await expect(page.getByRole("status").filter({ hasText: "You are signed out." })).toBeVisible();
  expect(await (await page.request.get("/api/auth/session")).json()).toBeNull();
  await page.goto("/labs/demo");
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Flabs%2Fdemo/);
});
