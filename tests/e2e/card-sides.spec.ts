// The designer's "Badge card" section on a phone-width screen: an educator picks side 2's lookup
// and range, sees what fits at 40 cm and when a range is wider than fits, saves through the
// chart save action, and the stored definition carries the choice; the default comes back by
// keyboard.
import { expect, test, type Page } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";

type ChartJson = { definition: { card?: { sides: unknown[] } | null } };
const savedCard = async (page: Page) => {
  const id = /\/charts\/(\d+)/.exec(page.url())?.[1];
  const res = await page.request.get(`/api/v1/charts/${id}`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as ChartJson).definition.card;
};

test("an educator sets side 2 of the badge card in the designer; the saved chart carries it", async ({ page }) => {
  await signInPage(page, demoEmail("educator"));
  await page.setViewportSize({ width: 320, height: 900 });
  await page.goto("/labs/demo/charts/new");
  await page.getByLabel("Title").fill(`E2E badge card ${Date.now().toString(36)}`);
  // Lookup 1: 8 rows (2.5-4.25), more than the card fits at 40 cm.
  await page.getByLabel("Lookup 1 rows from").fill("2.5");
  await page.getByLabel("Lookup 1 rows to").fill("4.25");
  await page.getByLabel("Lookup 1 rows step").fill("0.25");
  await page.getByRole("button", { name: "Add a lookup" }).click();

  const card = page.getByRole("group", { name: "Badge card" });
  const side1 = card.getByRole("group", { name: "Side 1" });
  const side2 = card.getByRole("group", { name: "Side 2" });
  await expect(side1.getByLabel("Lookup")).toHaveValue("0");
  await expect(side2.getByLabel("Lookup")).toHaveValue("1");
  await expect(side1).toContainText("Legible at 40 cm: up to 6 rows × 6 columns.");
  await expect(side1).toContainText(
    "Too wide: 8 rows (2.5–4.25 mm) are chosen but 6 fit, so the card prints the middle 6: 2.75–4.0 mm.",
  );

  // Side 2: lookup 2, its second to fourth row values.
  const rows = await side2
    .getByLabel("Rows from")
    .locator("option")
    .evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
  expect(rows.length).toBeGreaterThanOrEqual(4);
  const [from, to] = [rows[1]!, rows[3]!];
  await side2.getByLabel("Rows to").selectOption(from);
  await side2.getByLabel("Rows from").selectOption(to);
  // Backwards: the schema's message, at the field, before anything is sent.
  await expect(side2.getByText('"from" must not be above "to"')).toBeVisible();
  await expect(side2.getByLabel("Rows from")).toHaveAttribute("aria-invalid", "true");
  await side2.getByLabel("Rows from").selectOption(from);
  await side2.getByLabel("Rows to").selectOption(to);
  await expect(side2.getByText('"from" must not be above "to"')).toHaveCount(0);
  await expect(side2).toContainText(/Prints all 3 rows \(/);
  await expect(side2.getByRole("group", { name: /Rows:/ })).toContainText("Rows:");

  // Every control of the section stays inside the 320 px screen.
  for (const control of await card.locator("select, button").all()) {
    const box = (await control.boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(320);
  }

  await page.getByRole("button", { name: "Create chart" }).click();
  await expect(page).toHaveURL(/\/labs\/demo\/charts\/\d+$/);
  expect(await savedCard(page)).toEqual({
    sides: [{ lookup: 0 }, { lookup: 1, rows: [Number(from), Number(to)] }],
  });
  // The designer shows the saved choice again.
  await expect(page.getByRole("group", { name: "Side 2" }).getByLabel("Rows from")).toHaveValue(from);

  // Back to the default, by keyboard, and saved again.
  const reset = page.getByRole("button", { name: "Back to the default sides" });
  await reset.focus();
  await page.keyboard.press("Enter");
  await expect(reset).toHaveCount(0);
  await expect(page.getByRole("group", { name: "Side 2" }).getByLabel("Rows from")).toHaveValue(rows[0]!);
  await page.getByRole("button", { name: "Save chart" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Chart saved" })).toBeVisible();
  expect(await savedCard(page)).toBeNull();
});
