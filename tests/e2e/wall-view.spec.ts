// An operator who opens a chart reads its approved edition on the wall view: read-only, large
// cells with headings that stay in view, the status on top, the legend and the caution.
import { expect, test } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";
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
