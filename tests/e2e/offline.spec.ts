// After one visit the calculator and the wall views an operator opened still load offline and
// say so with the time of the last check; the check page says it cannot be verified; nothing
// that changes data is answered from the cache.
import { expect, test, type Page } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";
import { demoIds } from "./support/db";

/** Waits until the service worker controls the page and has kept `path`. */
async function kept(page: Page, path: string) {
  await page.waitForFunction(async (p) => {
    if (!navigator.serviceWorker.controller) return false;
    return Boolean(await caches.match(location.origin + p));
  }, path);
}

for (const size of [
  { width: 320, height: 640 },
  { width: 390, height: 844 },
]) {
  test(`at ${size.width}x${size.height} the wall view and the calculator work offline after one visit`, async ({
    browser,
  }) => {
    const ids = await demoIds();
    const wall = `/labs/demo/charts/${ids["chart:pot"]}/wall`;
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signInPage(page, demoEmail("operator"));
    await page.setViewportSize(size);
    await page.goto("/labs/demo/wall");
    // Reached by a client-side navigation, as an operator does.
    await page
      .getByTestId("wall-charts")
      .getByRole("link")
      .filter({ hasText: "POT balloon chart (demo)" })
      .first()
      .click();
    await page.waitForURL(`**${wall}`);
    await kept(page, wall);
    await page.goto("/calculator");
    await kept(page, "/calculator");
    await expect(page.getByTestId("offline-note")).toHaveCount(0);

    await context.setOffline(true);
    await page.goto(wall);
    await expect(page.getByTestId("offline-note")).toContainText(/^Offline: as of .*\d/);
    await expect(page.getByTestId("wall-grid").first().locator("td").first()).toBeVisible();
    await expect(page.getByRole("note", { name: "Clinical caution" })).toBeVisible();
    await page.screenshot({ path: `.data/reports/offline-wall-${size.width}.png` });

    await page.goto("/calculator");
    await expect(page.getByTestId("offline-note")).toContainText("Offline: as of");
    await page.getByLabel("Main branch (Dmb), mm").fill("3.5");
    await page.getByLabel("Side branch (Dsb), mm").fill("2.5");
    await expect(page.getByTestId("solve-result")).toContainText("4.07");

    // The check page is never answered from the cache.
    const check = await page.goto(`/v/${ids["token:pot"]}`);
    expect(check?.status()).toBe(503);
    await expect(page.getByRole("heading").first()).toHaveText("This printout cannot be verified now");
    await expect(page.getByTestId("check-offline")).toContainText("do not rely on its numbers");

    // A write offline fails rather than being answered from the cache.
    const write = await page.evaluate(() =>
      fetch("/api/v1/labs/demo/rooms", {
        method: "POST",
        body: "{}",
        headers: { "content-type": "application/json" },
      }).then(
        () => "answered",
        () => "failed",
      ),
    );
    expect(write).toBe("failed");

    await context.setOffline(false);
    await page.goto(wall);
    await expect(page.getByTestId("offline-note")).toHaveCount(0);
    await context.close();
  });
}
