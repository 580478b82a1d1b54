import { expect, test } from "@playwright/test";

test.describe("calculator", () => {
  test("solves a Finet parent and explains impossible geometry, with the caution shown", async ({ page }) => {
    await page.goto("/calculator");
    await expect(page.getByRole("note", { name: "Clinical caution" })).toContainText("Reference aid only");
    await page.getByLabel("Main branch (Dmb), mm").fill("3.5");
    await page.getByLabel("Side branch (Dsb), mm").fill("2.5");
    // Finet 0.678 x (3.5 + 2.5) = 4.068 (Finet et al., EuroIntervention 2008).
    await expect(page.getByTestId("solve-result")).toContainText("4.07");
    // Two decimals, never four.
    await expect(page.getByRole("region", { name: "Result" })).not.toContainText("4.0680");

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

test("computes in the browser: no request to the solve API while typing, and it keeps working offline", async ({
  page,
  context,
}) => {
  const solveCalls: string[] = [];
  page.on("request", (req) => {
    if (new URL(req.url()).pathname.startsWith("/api/v1/solve")) solveCalls.push(req.url());
  });
  await page.goto("/calculator");
  await page.getByLabel("Main branch (Dmb), mm").fill("3.5");
  await page.getByLabel("Side branch (Dsb), mm").fill("2.5");
  await expect(page.getByTestId("solve-result")).toContainText("4.07");
  await context.setOffline(true);
  const sb = page.getByLabel("Side branch (Dsb), mm");
  await sb.fill("");
  await sb.pressSequentially("2.75", { delay: 30 });
  // Finet: 0.678 x (3.5 + 2.75) = 4.2375 -> 4.24 (Finet et al., EuroIntervention 2008).
  await expect(page.getByTestId("solve-result")).toContainText("4.24");
  await page.getByLabel("Main branch (Dmb), mm").fill("12");
  await expect(page.getByRole("region", { name: "Result" }).getByRole("alert")).toContainText(
    "Main branch: must be at most 10 mm",
  );
  await expect(page.getByText("Main branch: must be at most 10 mm").first()).toBeVisible();
  await context.setOffline(false);
  expect(solveCalls).toEqual([]);
});

for (const size of [
  { width: 320, height: 640 },
  { width: 390, height: 844 },
]) {
  test(`at ${size.width}x${size.height} the inputs come first and no result shows before two diameters`, async ({
    browser,
  }) => {
    const context = await browser.newContext({ viewport: size });
    const page = await context.newPage();
    await page.goto("/calculator");
    await expect(page.getByTestId("calculator-waiting")).toBeVisible();
    await expect(page.getByRole("region", { name: "Result" })).toHaveCount(0);
    await expect(page.getByTestId("solve-result")).toHaveCount(0);
    await page.getByLabel("Main branch (Dmb), mm").fill("3.5");
    await expect(page.getByRole("region", { name: "Result" })).toHaveCount(0);
    await page.getByLabel("Side branch (Dsb), mm").fill("2.5");
    await expect(page.getByTestId("solve-result")).toContainText("4.07");
    const result = (await page.getByRole("region", { name: "Result" }).boundingBox())!;
    const lastInput = (await page.getByLabel("Side branch (Dsb), mm").boundingBox())!;
    expect(result.y).toBeGreaterThan(lastInput.y);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `.data/reports/calculator-${size.width}.png`, fullPage: true });
    await context.close();
  });
}

test("a signed-in member chooses a lab chart and reads its stocked size, as the chart cell prints it", async ({
  page,
}) => {
  const { demoEmail, signInPage } = await import("./support/auth");
  const solveCalls: string[] = [];
  page.on("request", (req) => {
    if (new URL(req.url()).pathname.startsWith("/api/v1/solve")) solveCalls.push(req.url());
  });
  await signInPage(page, demoEmail("operator"));
  await page.goto("/calculator");
  const picker = page.getByLabel("Size as an approved chart of my lab");
  // Only approved charts, each named with its edition.
  const labels = await picker.locator("option").allTextContents();
  expect(
    labels.slice(1).every((l) => / · edition \d+ · /.test(l)),
    labels.join("\n"),
  ).toBe(true);
  const option = picker
    .locator("option", { hasText: /POT balloon chart \(demo\) · edition \d+ · POT balloon/ })
    .first();
  await picker.selectOption((await option.getAttribute("value"))!);
  await page.getByLabel("Main branch (Dmb), mm").fill("3");
  await page.getByLabel("Side branch (Dsb), mm").fill("2.5");
  // Finet 0.678 x 5.5 = 3.729 -> the demo NC family's next stocked size up is 3.75 mm; the chart's
  // own cell (the wall view) prints the same.
  await expect(page.getByTestId("lab-size")).toContainText("3.75");
  await expect(page.getByTestId("lab-result")).toContainText("Exact by the law: 3.73 mm");
  expect(solveCalls).toEqual([]);
});
