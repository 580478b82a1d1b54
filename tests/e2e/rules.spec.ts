// The lab rules page as each role sees it: the medical lead edits (bad input names the field
// and saves nothing), everyone else reads; it fits 1440, 390 and 320 px wide screens; and the
// change reaches the audit log in words.
import { expect, test, type Page } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";
import { query } from "./support/db";

const rulesRow = async () =>
  (
    await query<{ revision: number }>(
      "SELECT r.revision FROM lab_rules r JOIN labs l ON l.id = r.lab_id WHERE l.slug = 'demo'",
    )
  )[0]?.revision ?? 0;

async function noSideways(page: Page) {
  const { scroll, width } = await page.evaluate(() => ({
    scroll: document.documentElement.scrollWidth,
    width: window.innerWidth,
  }));
  expect(scroll, "page wider than the screen").toBeLessThanOrEqual(width);
}

test("the medical lead edits the rules; bad input is refused naming the field; the change is audited in words", async ({
  page,
  browser,
}) => {
  await signInPage(page, demoEmail("lead"));
  await page.goto("/labs/demo/rules");
  await expect(page.getByRole("heading", { name: "Lab rules", level: 1 })).toBeVisible();
  const before = await rulesRow();

  // An empty review period: refused with the field named, nothing saved.
  const period = page.getByLabel("Review period (months)");
  await period.fill("");
  await page.getByRole("button", { name: "Save the rules" }).click();
  await expect(page.locator("#review-period-error")).toContainText("Review period");
  await expect(period).toHaveAttribute("aria-invalid", "true");
  // An exception without a reason: refused on the reason field.
  await period.fill("12");
  await page.getByRole("button", { name: "Add an exception" }).click();
  await page.getByRole("button", { name: "Save the rules" }).click();
  await expect(page.locator("#ex-0-reason-error")).toContainText("Give the reason");
  expect(await rulesRow()).toBe(before);
  await page.getByRole("button", { name: /^Remove the exception/ }).click();

  // Side-branch lookups may no longer use the power law: saved, kept on reload.
  const side = page.getByRole("region", { name: "Side-branch lookup" });
  await side.getByRole("checkbox", { name: "Power" }).uncheck();
  await page.getByRole("button", { name: "Save the rules" }).click();
  await expect(page.getByRole("status").filter({ hasText: "The rules were saved" })).toBeVisible();
  expect(await rulesRow()).toBe(before + 1);
  await page.reload();
  await expect(side.getByRole("checkbox", { name: "Power" })).not.toBeChecked();

  // The manager reads the change in the audit log, filtered to rules, in words.
  const ctx = await browser.newContext();
  const manager = await ctx.newPage();
  await signInPage(manager, demoEmail("manager"));
  await manager.goto("/labs/demo/audit");
  await manager.getByLabel("Kind of event").selectOption("rules");
  await manager.getByRole("button", { name: "Show" }).click();
  await expect(manager).toHaveURL(/kind=rules/);
  const row = manager.locator('tr[data-action="lab.rules_updated"]').first();
  await expect(row).toContainText("Changed the lab rules");
  await expect(row).toContainText("Side-branch lookup › Laws allowed");
  await expect(row).not.toContainText("laws");
  await expect(manager.locator("tbody tr").filter({ hasNotText: "Changed the lab rules" })).toHaveCount(0);
  await ctx.close();

  // Put the rule back for the other tests.
  await side.getByRole("checkbox", { name: "Power" }).check();
  await page.getByRole("button", { name: "Save the rules" }).click();
  await expect(page.getByRole("status").filter({ hasText: "The rules were saved" })).toBeVisible();
  expect(await rulesRow()).toBe(before + 2);
});

test("everyone else reads the rules and cannot change them", async ({ page }) => {
  await signInPage(page, demoEmail("educator"));
  await page.goto("/labs/demo/rules");
  await expect(page.getByText("Only the medical lead changes them.")).toBeVisible();
  await expect(page.getByRole("button", { name: "Save the rules" })).toHaveCount(0);
  const pot = page.getByRole("region", { name: "POT (proximal) lookup" });
  await expect(pot).toContainText("Laws allowed");
  await expect(pot).toContainText("Finet (ratio 0.678)");
});

for (const width of [1440, 390, 320]) {
  test(`the rules page fits a ${width} px screen and works from the keyboard`, async ({ page }) => {
    await signInPage(page, demoEmail("lead"));
    await page.setViewportSize({ width, height: 900 });
    await page.goto("/labs/demo/rules");
    await expect(page.getByRole("button", { name: "Save the rules" })).toBeVisible();
    await noSideways(page);
    // Every control is reachable with Tab: the review period, then on to the save button.
    await page.getByLabel("Review period (months)").focus();
    let reached = false;
    for (let i = 0; i < 60 && !reached; i++) {
      await page.keyboard.press("Tab");
      reached = await page
        .getByRole("button", { name: "Save the rules" })
        .evaluate((b) => b === document.activeElement);
    }
    expect(reached).toBe(true);
  });
}
