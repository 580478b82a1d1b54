import { expect, test } from "@playwright/test";

test.describe("calculator", () => {
  test("solves a Finet parent and explains impossible geometry, with the caution shown", async ({ page }) => {
    await page.goto("/calculator");
    await expect(page.getByRole("note", { name: "Clinical caution" })).toContainText("Reference aid only");
    // Defaults: Finet 0.678, MB 3.5, SB 2.5 -> 4.068 (Finet et al., EuroIntervention 2008).
    await expect(page.getByTestId("solve-result")).toContainText("4.07");
    await expect(page.getByText("Exact: 4.0680 mm")).toBeVisible();

    await page.getByLabel("Side branch (Dsb), mm").fill("1.2");
    await expect(page.getByRole("region", { name: "Result" }).getByRole("alert")).toContainText("No size");

    await page.getByLabel("Law").selectOption("murray");
    await page.getByLabel("Side branch (Dsb), mm").fill("3");
    await page.getByLabel("Main branch (Dmb), mm").fill("3");
    // Murray: 3 x 2^(1/3) = 3.7798 (Murray, PNAS 1926).
    await expect(page.getByTestId("solve-result")).toContainText("3.78");
  });

  test("is usable on a phone", async ({ browser }) => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await page.goto("/calculator");
    await page.getByRole("radio", { name: "Side branch" }).check();
    await page.getByLabel("Parent (proximal main vessel) (Dp), mm").fill("4");
    await page.getByLabel("Main branch (Dmb), mm").fill("3.5");
    await expect(page.getByTestId("solve-result")).toBeVisible();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await context.close();
  });
});
