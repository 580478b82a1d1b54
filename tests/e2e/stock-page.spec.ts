// The stock page in Chromium: a manager imports a file and edits inline; an operator only reads.
import { expect, test, type Page } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";

test("a manager imports a CSV through the page: preview, apply, new sizes in the table, history", async ({ page }) => {
  const family = `E2E family ${Date.now().toString(36)} (illustrative)`;
  await signInPage(page, demoEmail("manager"));
  await page.goto("/labs/demo/stock");
  await expect(page.getByRole("heading", { name: "Stock", level: 1 })).toBeVisible();
  await expect(page.getByRole("note", { name: "Clinical caution" })).toContainText("Reference aid only");
  const revision = Number((await page.getByTestId("stock-revision").textContent())!.match(/\d+/)![0]);

  const csv = [
    "\uFEFFfamily;compliance;diameter_mm;in_stock;nominal_atm;rbp_atm;growth_at_rbp_mm",
    `${family};sc;2,25;yes;9;15;0,30`,
    `${family};sc;2,75;no;;;`,
    `"${family}";sc;3,05;yes;;;`,
  ].join("\r\n");
  await page
    .getByLabel("Drop a CSV file here, or choose one")
    .setInputFiles({ name: "new-family.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });

  const preview = page.getByTestId("import-preview");
  await expect(preview).toContainText("This import would make: 1 family added, 3 sizes added.");
  await expect(preview.getByRole("table", { name: "Families to add" })).toContainText(family);
  await expect(preview.getByRole("table", { name: "Sizes to add" }).getByRole("row")).toHaveCount(4);
  // The preview saved nothing.
  await expect(page.getByTestId("stock-revision")).toHaveText(`Stock revision ${revision}`);

  await preview.getByRole("button", { name: "Apply import" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Imported new-family.csv" })).toContainText(
    `Stock revision ${revision + 1}`,
  );
  await expect(page.getByTestId("stock-revision")).toHaveText(`Stock revision ${revision + 1}`);

  const familyRow = page
    .getByTestId("balloon-families")
    .getByRole("row", { name: new RegExp(family.replace(/[()]/g, "\\$&")) })
    .first();
  await expect(familyRow).toContainText("Semi-compliant (SC)");
  await expect(familyRow).toContainText("2 of 3");
  const sizes = page.getByRole("table", { name: `Sizes of ${family}` });
  await expect(sizes.getByRole("row")).toHaveCount(4);
  await expect(sizes.getByRole("rowheader")).toHaveText(["2.25", "2.75", "3.05"]);
  await expect(page.getByRole("switch", { name: `${family} 2.75 mm in stock` })).toHaveAttribute(
    "aria-checked",
    "false",
  );

  const latest = page.getByTestId("stock-history").getByRole("listitem").first();
  await expect(latest).toContainText("CSV import");
  await expect(latest).toContainText("Imported new-family.csv: 1 family added, 3 sizes added");
  await latest.locator("summary", { hasText: "Before and after" }).click();
  await expect(
    latest.getByRole("row", { name: new RegExp(`${family.replace(/[()]/g, "\\$&")} 2.75 mm`) }),
  ).toContainText("out of stock");
});

test("a bad file shows each bad line and saves nothing", async ({ page }) => {
  await signInPage(page, demoEmail("manager"));
  await page.goto("/labs/demo/stock");
  const revision = await page.getByTestId("stock-revision").textContent();
  const csv =
    "family,compliance,diameter_mm,in_stock\nNC family A (illustrative),nc,2,75,yes\nNC family A (illustrative),nc,9.00,maybe\n";
  await page
    .getByLabel("Drop a CSV file here, or choose one")
    .setInputFiles({ name: "bad.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
  const alert = page.getByRole("alert").filter({ hasText: "bad.csv" });
  await expect(alert).toContainText("2 lines have problems; nothing was imported.");
  await expect(alert.getByRole("listitem")).toHaveText([
    'Line 2: This line has 5 fields but the header has 4. A decimal comma in a comma-separated file must be quoted ("2,75"), or use a decimal point (2.75).',
    "Line 3: diameter_mm: Diameter must be at most 7.00 mm.",
    'Line 3: in_stock: "maybe" is not one of yes, no, y, n, true, false, 1, 0.',
  ]);
  await page.reload();
  await expect(page.getByTestId("stock-revision")).toHaveText(revision!);
});

/** A change that outdates a posted copy asks first; the manager confirms from the keyboard. */
async function confirmIfAsked(page: Page) {
  const dialog = page.getByRole("dialog", { name: "Posted copies will go out of date" });
  const done = page.getByRole("status").filter({ hasText: "3.25 mm marked" });
  await expect(dialog.or(done).first()).toBeVisible();
  if (await dialog.isVisible()) {
    await dialog.getByRole("button", { name: /^Mark (out of|in) stock$/ }).focus();
    await page.keyboard.press("Enter");
  }
}

test("a manager toggles a size from the keyboard and the change persists", async ({ page }) => {
  await signInPage(page, demoEmail("manager"));
  await page.goto("/labs/demo/stock");
  const toggle = page.getByRole("switch", { name: "NC family A (illustrative) 3.25 mm in stock" });
  const was = await toggle.getAttribute("aria-checked");
  const now = was === "true" ? "false" : "true";
  await toggle.focus();
  await page.keyboard.press("Space");
  await confirmIfAsked(page);
  await expect(page.getByRole("status").filter({ hasText: "3.25 mm marked" })).toBeVisible();
  await page.reload();
  await expect(page.getByRole("switch", { name: "NC family A (illustrative) 3.25 mm in stock" })).toHaveAttribute(
    "aria-checked",
    now,
  );
  await page.getByRole("switch", { name: "NC family A (illustrative) 3.25 mm in stock" }).press("Enter");
  await confirmIfAsked(page);
  await expect(page.getByRole("status").filter({ hasText: "3.25 mm marked" })).toBeVisible();
  await page.reload();
  await expect(page.getByRole("switch", { name: "NC family A (illustrative) 3.25 mm in stock" })).toHaveAttribute(
    "aria-checked",
    was!,
  );
});

test("a manager adds a size through the form; the form keeps errors on the field", async ({ page }) => {
  await signInPage(page, demoEmail("manager"));
  await page.goto("/labs/demo/stock");
  await page.getByRole("button", { name: "Add size to DES platform Y (illustrative)" }).click();
  const dialog = page.getByRole("dialog", { name: "Add a size to DES platform Y (illustrative)" });
  await dialog.getByLabel("Nominal diameter (mm)").fill("5,5");
  await dialog.getByLabel("Maximum post-dilatation diameter (mm)").fill("8");
  await dialog.getByRole("button", { name: "Add size" }).click();
  await expect(
    dialog.getByText("Maximum post-dilatation diameter must be at most nominal + 2.00 mm (7.50 mm)."),
  ).toBeVisible();
  await dialog.getByLabel("Nominal diameter (mm)").fill("3,00");
  await dialog.getByLabel("Maximum post-dilatation diameter (mm)").fill("4,5");
  await dialog.getByRole("button", { name: "Add size" }).click();
  await expect(dialog.getByRole("alert")).toContainText("DES platform Y (illustrative) already has a 3.00 mm size.");
  await expect(dialog.getByLabel("Nominal diameter (mm)")).toHaveValue("3,00");
  await dialog.getByRole("button", { name: "Cancel" }).click();
  await expect(dialog).toBeHidden();
});

test("an operator sees the tables read-only, and the server refuses a change anyway", async ({ page }) => {
  await signInPage(page, demoEmail("operator"));
  await page.goto("/labs/demo/stock");
  await expect(page.getByTestId("read-only-note")).toContainText("read-only for you");
  await expect(page.getByRole("note", { name: "Clinical caution" })).toBeVisible();
  const families = page.getByTestId("balloon-families");
  await expect(families.getByRole("row", { name: /NC family A \(illustrative\)/ }).first()).toBeVisible();
  await expect(
    page.getByRole("table", { name: "Sizes of NC family A (illustrative)" }).getByRole("row", { name: /4\.75/ }),
  ).toContainText("Out of stock");
  await expect(page.getByRole("table", { name: "Sizes of DES platform X (illustrative)" })).toContainText("3.50");

  await expect(page.getByRole("switch")).toHaveCount(0);
  for (const name of ["Add balloon family", "Add stent platform", /^Add size/, /^Edit/, /^Delete/, /^Rename/])
    await expect(page.getByRole("button", { name })).toHaveCount(0);
  await expect(page.getByRole("heading", { name: /Import balloons/ })).toHaveCount(0);
  await expect(page.locator('input[type="file"]')).toHaveCount(0);
  await expect(page.getByRole("heading", { name: "Stock history" })).toBeVisible();

  const stock = await (await page.request.get("/api/v1/labs/demo/stock")).json();
  const res = await page.request.patch(`/api/v1/labs/demo/stock/balloons/${stock.balloonFamilies[0].balloons[0].id}`, {
    data: { inStock: false },
  });
  expect(res.status()).toBe(403);
});
