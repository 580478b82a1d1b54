// An operator who opens a chart reads its approved edition on the wall view: read-only, large
// cells with headings that stay in view, the status on top, the legend and the caution.
import { expect, test } from "@playwright/test";
import { DEMO_PASSWORD, demoEmail, signInPage } from "./support/auth";
import { demoIds } from "./support/db";

for (const size of [
  { width: 320, height: 640 },
  { width: 390, height: 844 },
]) {
  test(`at ${size.width}x${size.height} an operator opens a chart and lands on the wall view`, async ({ browser }) => {
    const ids = await demoIds();
    const context = await browser.newContext();
    const page = await context.newPage();
    // Signed in at the default size (the header names the user only on wider screens), then the phone.
    await signInPage(page, demoEmail("operator"));
    await page.setViewportSize(size);
    await page.goto("/labs/demo/charts");
    await page.getByRole("link", { name: "POT balloon chart (demo)" }).first().click();
    await page.waitForURL(`**/labs/demo/charts/${ids["chart:pot"]}/wall`);
    await expect(page.getByTestId("wall-status")).toContainText(/Edition \d+ · Current/);
    // The grid's first row is on the first 640 px, the status one line above it, the caution below.
    const firstRow = (await page.getByTestId("wall-grid").first().locator("tbody tr").first().boundingBox())!;
    expect(firstRow.y + firstRow.height).toBeLessThanOrEqual(640);
    const status = (await page.getByTestId("wall-status").boundingBox())!;
    expect(status.height).toBeLessThanOrEqual(44);
    expect(status.y).toBeLessThan(firstRow.y);
    const caution = (await page.getByRole("note", { name: "Clinical caution" }).boundingBox())!;
    const lastGrid = (await page.getByTestId("wall-scroll").last().boundingBox())!;
    expect(caution.y).toBeGreaterThan(lastGrid.y + lastGrid.height - 1);
    await page.screenshot({ path: `.data/reports/wall-${size.width}.png` });
    // Read-only: no form fields at all.
    await expect(page.locator("main input, main select, main textarea")).toHaveCount(0);
    const grid = page.getByTestId("wall-grid").first();
    await expect(grid.locator("td").first()).toBeVisible();
    await expect(page.getByRole("heading", { name: "How to read a cell" })).toBeVisible();
    await expect(page.getByRole("note", { name: "Clinical caution" })).toBeVisible();
    // The page itself never scrolls sideways; the grid scrolls inside its own box.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    // Scrolled right and down, the first column heading and the first row heading stay in view.
    const box = page.getByTestId("wall-scroll").first();
    await box.evaluate((el) => el.scrollTo(el.scrollWidth, el.scrollHeight));
    const boxRect = (await box.boundingBox())!;
    const colHead = (await grid.locator("thead th").nth(1).boundingBox())!;
    const rowHead = (await grid.locator("tbody th").last().boundingBox())!;
    expect(Math.abs(colHead.y - boxRect.y)).toBeLessThan(3);
    expect(Math.abs(rowHead.x - boxRect.x)).toBeLessThan(3);
    // The cells are large: the printed balloon size is at least 24 px high.
    const fontPx = await grid
      .locator("td span.text-3xl")
      .first()
      .evaluate((el) => parseFloat(getComputedStyle(el).fontSize));
    expect(fontPx).toBeGreaterThanOrEqual(24);
    await context.close();
  });
}

test("a role that designs charts still opens the designer, with a link to the wall view", async ({ page }) => {
  const ids = await demoIds();
  await signInPage(page, demoEmail("educator"));
  await page.goto(`/labs/demo/charts/${ids["chart:pot"]}`);
  expect(new URL(page.url()).pathname).toBe(`/labs/demo/charts/${ids["chart:pot"]}`);
  await page.getByRole("link", { name: "Wall view of the approved edition" }).click();
  await expect(page.getByTestId("wall-status")).toBeVisible();
});

for (const size of [
  { width: 320, height: 640 },
  { width: 390, height: 844 },
]) {
  test(`at ${size.width}x${size.height} the header is one line and its menu stays on screen and closes`, async ({
    browser,
  }) => {
    const context = await browser.newContext({ viewport: size });
    const page = await context.newPage();
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(demoEmail("operator"));
    await page.getByLabel("Password", { exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in", exact: true }).click();
    // An operator lands on the lab's approved wall charts.
    await page.waitForURL("**/labs/demo/wall");
    await expect(page.getByRole("heading", { name: "Wall charts" })).toBeVisible();
    await expect(page.getByTestId("wall-charts").getByRole("link").first()).toBeVisible();
    const header = (await page.locator("header").first().boundingBox())!;
    expect(header.height).toBeLessThanOrEqual(64);
    const menuButton = page.getByRole("button", { name: "Menu" });
    await menuButton.click();
    const menu = page.getByTestId("phone-menu");
    await expect(menu).toBeVisible();
    const box = (await menu.boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(size.width);
    await page.screenshot({ path: `.data/reports/menu-${size.width}.png` });
    // Escape closes it and gives focus back to its button; so does a tap outside.
    await page.keyboard.press("Escape");
    await expect(menu).toHaveCount(0);
    await expect(menuButton).toBeFocused();
    await menuButton.click();
    await expect(menu).toBeVisible();
    await page.mouse.click(size.width / 2, size.height - 20);
    await expect(menu).toHaveCount(0);
    await context.close();
  });
}
