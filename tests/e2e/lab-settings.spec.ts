// Lab settings and machine tokens in the browser: a manager sees the settings page at phone
// width, a bad time zone is refused on its field, and a token is created, shown once, used by a
// machine, and revoked.
import { expect, request, test } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";

test("the settings page fits a 390 px phone and refuses a time zone that does not exist", async ({ page }) => {
  await signInPage(page, demoEmail("manager"), undefined, "/labs/demo/settings");
  // Signed in at desktop width (the header shows who is signed in there), then the phone.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto("/labs/demo/settings");
  await expect(page.getByRole("heading", { name: "Lab settings" })).toBeVisible();
  await expect(page.getByRole("heading", { name: "Machine tokens" })).toBeVisible();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);

  const form = page.getByRole("form", { name: "Lab settings" });
  const zone = form.getByLabel("Time zone");
  const before = await zone.inputValue();
  await zone.fill("Mars/Olympus_Mons");
  await form.getByRole("button", { name: "Save settings" }).click();
  await expect(form.getByText(/IANA time-zone name/)).toBeVisible();
  await page.reload();
  await expect(page.getByRole("form", { name: "Lab settings" }).getByLabel("Time zone")).toHaveValue(before);
});

test("other roles read the settings but cannot change them or see tokens", async ({ page }) => {
  await signInPage(page, demoEmail("operator"), undefined, "/labs/demo/settings");
  await page.goto("/labs/demo/settings");
  await expect(page.getByRole("heading", { name: "Lab settings" })).toBeVisible();
  await expect(page.getByText("Only the lab's managers change these.")).toBeVisible();
  await expect(page.getByRole("form", { name: "Lab settings" })).toHaveCount(0);
  await expect(page.getByRole("heading", { name: "Machine tokens" })).toHaveCount(0);
});

test("a manager creates a token, sees it once, a machine uses it, and the manager revokes it", async ({
  page,
  baseURL,
}) => {
  const name = `e2e feed ${Date.now().toString(36)}`;
  await signInPage(page, demoEmail("manager"), undefined, "/labs/demo/settings");
  await page.goto("/labs/demo/settings");
  const form = page.getByRole("form", { name: "Create a token" });
  await form.getByLabel("Token name").fill(name);
  // Read-only by default: the write scope starts unticked.
  await expect(form.getByLabel("Change stock (stock:write)")).not.toBeChecked();
  await expect(form.getByLabel("Read stock (stock:read)")).toBeChecked();
  await form.getByRole("button", { name: "Create token" }).click();
  const shown = page.getByTestId("new-token").getByRole("textbox");
  await expect(shown).toHaveValue(/^fwt_[A-Za-z0-9_-]{43}$/);
  const token = await shown.inputValue();
  const row = page.getByTestId(`token-${name}`);
  await expect(row).toContainText("stock:read");
  await expect(row).not.toContainText("stock:write");
  await expect(row).toContainText("last used never");

  // The machine: no cookie, no Origin; only the Bearer header.
  const machine = await request.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${token}` } });
  const stock = await machine.get("/api/v1/labs/demo/stock");
  expect(stock.status()).toBe(200);
  expect(((await stock.json()) as { balloonFamilies: unknown[] }).balloonFamilies.length).toBeGreaterThan(0);
  expect((await machine.get("/api/v1/labs/demo/members")).status()).toBe(403);
  expect((await machine.get("/api/v1/labs/demo-north/stock")).status()).toBe(404);

  // Shown once: after a reload only the name and hint remain, with the last use.
  await page.reload();
  await expect(page.getByTestId("new-token")).toHaveCount(0);
  expect(await page.content()).not.toContain(token.slice(4));
  await expect(page.getByTestId(`token-${name}`)).not.toContainText("last used never");

  await page
    .getByTestId(`token-${name}`)
    .getByRole("button", { name: /Revoke/ })
    .click();
  const ask = page.getByRole("dialog", { name: `Revoke the token "${name}"?` });
  await expect(ask).toContainText("Every request with it is refused");
  await ask.getByRole("button", { name: "Revoke token" }).click();
  await expect(page.getByRole("status").filter({ hasText: `Token "${name}" revoked` })).toBeVisible();
  await expect(page.getByTestId(`token-${name}`)).toHaveCount(0);
  const refused = await machine.get("/api/v1/labs/demo/stock");
  expect(refused.status()).toBe(401);
  expect(refused.headers()["www-authenticate"]).toMatch(/^Bearer/);
  await machine.dispose();
});
