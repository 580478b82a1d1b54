// The account and member pages load and work under the app's Content-Security-Policy: Chromium
// reports no violation, no script error, on any of them.
import { expect, test, type Page } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";
import { waitForMail } from "../support/mail";

function watch(page: Page) {
  const problems: string[] = [];
  page.on("console", (msg) => {
    if (/Content.Security.Policy|Refused to (load|execute|apply|connect|frame)/i.test(msg.text()))
      problems.push(`${page.url()}: ${msg.text()}`);
  });
  page.on("pageerror", (err) => problems.push(`${page.url()}: ${err.message}`));
  return problems;
}

const PUBLIC = [
  "/",
  "/sign-in",
  "/forgot-password",
  "/reset-password/" + "x".repeat(43),
  "/invite/" + "y".repeat(43),
  "/sign-out",
];
const MANAGER = ["/dashboard", "/labs/demo", "/labs/demo/members", "/labs/demo/audit", "/dev/mail", "/sign-out"];

test("no CSP violations or script errors on the public and account pages", async ({ page }) => {
  const problems = watch(page);
  for (const path of PUBLIC) {
    const res = await page.goto(path);
    expect(res?.status(), path).toBe(200);
    await page.waitForLoadState("load");
  }
  // A server action round trip (form post and client update) under the policy.
  await page.goto("/forgot-password");
  await page.getByLabel("E-mail").fill("someone@example.test");
  await page.getByRole("button", { name: "Send the link" }).click();
  await expect(page.getByRole("status").filter({ hasText: "If an account uses" })).toBeVisible();
  expect(problems).toEqual([]);
});

test("no CSP violations or script errors on the manager's pages, including sorting and a two-step confirm", async ({
  page,
}) => {
  const problems = watch(page);
  await signInPage(page, demoEmail("manager"));
  for (const path of MANAGER) {
    const res = await page.goto(path);
    expect(res?.status(), path).toBe(200);
    await page.waitForLoadState("load");
  }
  await page.goto("/labs/demo/members");
  await page.getByRole("button", { name: /^Name/ }).click();
  await expect(page.getByRole("columnheader", { name: /Name/ })).toHaveAttribute("aria-sort", "ascending");
  const firstRemove = page.getByRole("button", { name: /^Remove…/ }).first();
  await firstRemove.click();
  await page.getByRole("button", { name: "Cancel" }).click();
  expect(problems).toEqual([]);
});

test("/dev/mail shows each signed-in person only their own mail", async ({ page, browser }) => {
  await page.goto("/forgot-password");
  await page.getByLabel("E-mail").fill(demoEmail("manager"));
  await page.getByRole("button", { name: "Send the link" }).click();
  await waitForMail(demoEmail("manager"));
  await signInPage(page, demoEmail("manager"));
  const res = await page.goto(`/dev/mail?to=${encodeURIComponent(demoEmail("operator"))}`);
  expect(res?.status()).toBe(200);
  await expect(page.getByRole("heading", { name: "Local mail" })).toBeVisible();
  await expect(page.getByRole("heading", { name: "Reset your Forkwall password" }).first()).toBeVisible();
  await expect(page.getByRole("link", { name: /\/reset-password\// }).first()).toBeVisible();

  const anon = await browser.newContext();
  expect((await (await anon.newPage()).goto("/dev/mail"))?.status()).toBe(404);
  await anon.close();

  // Another person, whatever their role, never sees the manager's reset link.
  const op = await browser.newContext();
  const opPage = await op.newPage();
  await signInPage(opPage, demoEmail("operator"));
  expect((await opPage.goto(`/dev/mail?to=${encodeURIComponent(demoEmail("manager"))}`))?.status()).toBe(200);
  await expect(opPage.getByText(demoEmail("operator")).first()).toBeVisible();
  await expect(opPage.getByText(demoEmail("manager"))).toHaveCount(0);
  await op.close();
});
