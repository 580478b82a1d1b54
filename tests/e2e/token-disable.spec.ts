// A manager's machine token stops when they are removed from the lab: the settings page says
// which token and why, and another manager re-issues it, seeing the new secret once.
import { expect, test } from "@playwright/test";
import { createPerson } from "./support/db";
import { demoEmail, signInApi, signInPage } from "./support/auth";

test("a removed manager's token is disabled, shown with the reason, and re-issued by another manager", async ({
  page,
  playwright,
  baseURL,
}) => {
  const password = "token-maker-pass-2026";
  const maker = await createPerson({ prefix: "token-maker", password, lab: "demo-north", role: "manager" });
  const name = `e2e disabled feed ${Date.now().toString(36)}`;
  const makerApi = await playwright.request.newContext({ baseURL });
  await signInApi(makerApi, maker.email, password);
  const created = await makerApi.post("/api/v1/labs/demo-north/tokens", { data: { name, scopes: ["stock:read"] } });
  expect(created.status()).toBe(201);
  const { token } = (await created.json()) as { token: string };
  await makerApi.dispose();

  const machine = await playwright.request.newContext({ baseURL });
  const read = () => machine.get("/api/v1/labs/demo-north/stock", { headers: { authorization: `Bearer ${token}` } });
  expect((await read()).status()).toBe(200);

  const manager = await playwright.request.newContext({ baseURL });
  await signInApi(manager, demoEmail("manager"));
  expect((await manager.delete(`/api/v1/labs/demo-north/members/${maker.membershipId}`)).status()).toBe(204);
  await manager.dispose();
  expect((await read()).status()).toBe(401);

  await signInPage(page, demoEmail("manager"), undefined, "/labs/demo-north/settings");
  await page.setViewportSize({ width: 320, height: 800 });
  await page.goto("/labs/demo-north/settings");
  await expect(page.getByTestId("tokens-disabled")).toContainText("disabled because the person who created");
  const row = page.getByTestId(`token-${name}`);
  await expect(row).toContainText(`Its creator, ${maker.name}, was removed from the lab.`);
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);

  await row.getByRole("button", { name: `Re-issue ${name}` }).click();
  await expect(page.getByText(`Token "${name}" re-issued.`)).toBeVisible();
  const secret = await page.getByLabel(`The token for “${name}” (shown only now)`).inputValue();
  expect(secret).toMatch(/^fwt_/);
  expect(secret).not.toBe(token);
  const fresh = await machine.get("/api/v1/labs/demo-north/stock", { headers: { authorization: `Bearer ${secret}` } });
  expect(fresh.status()).toBe(200);
  expect((await read()).status()).toBe(401);
  await machine.dispose();
});
