import { chromium } from "@playwright/test";
import { writeFileSync } from "node:fs";
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--disable-dev-shm-usage"] });
const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
const base = "http://localhost:3030";
await page.goto(base + "/sign-in");
await page.getByLabel("E-mail").fill("manager@forkwall.test");
await page.getByLabel("Password").fill("forkwall-demo-2026");
await page.getByRole("button", { name: "Sign in" }).click();
await page.waitForURL(/dashboard/);
await page.goto(base + "/labs/demo/stock");
// toggle
await page.getByRole("switch", { name: "NC family A (illustrative) 3.25 mm in stock" }).click();
await page.waitForTimeout(1500);
await page.screenshot({ path: ".data/shots/toggled.png" });
// add family with errors
await page.getByRole("button", { name: "Add balloon family" }).click();
await page.getByLabel("Name").fill("NC family A (illustrative)");
await page.getByLabel("Nominal pressure (atm)").fill("22");
await page.getByLabel("Rated burst pressure (atm)").fill("20");
await page.getByRole("button", { name: "Add family" }).click();
await page.waitForTimeout(500);
await page.screenshot({ path: ".data/shots/family-errors.png" });
await page.getByLabel("Nominal pressure (atm)").fill("12,5");
await page.getByRole("button", { name: "Add family" }).click();
await page.waitForTimeout(1000);
await page.screenshot({ path: ".data/shots/family-409.png" });
await page.keyboard.press("Escape");
// import
writeFileSync(".data/import.csv", "family;compliance;diameter_mm;in_stock;nominal_atm;rbp_atm;growth_at_rbp_mm\r\nNC family A (illustrative);nc;2,00;yes;;;\r\nNC family A (illustrative);nc;2,25;no;;;\r\nNC family D (illustrative);nc;2,50;yes;14;22;0,15\r\nNC family D (illustrative);nc;3,00;yes;;;\r\n");
await page.locator('input[type=file]').setInputFiles(".data/import.csv");
await page.getByTestId("import-preview").waitFor();
await page.getByTestId("import-preview").screenshot({ path: ".data/shots/preview.png" });
await page.getByRole("button", { name: "Apply import" }).click();
await page.getByText(/Imported import.csv/).waitFor();
await page.waitForTimeout(1500);
await page.screenshot({ path: ".data/shots/after-import.png", fullPage: true });
// bad file
writeFileSync(".data/bad.csv", "family,compliance,diameter_mm,in_stock\nX,nc,2,75,yes\nY,zz,9,maybe\n");
await page.locator('input[type=file]').setInputFiles(".data/bad.csv");
await page.getByRole("alert").filter({ hasText: "bad.csv" }).waitFor();
await page.getByRole("alert").filter({ hasText: "bad.csv" }).screenshot({ path: ".data/shots/bad.png" });
await page.locator("#stock-history-heading").scrollIntoViewIfNeeded();
await page.getByText("Before and after").first().click();
await page.getByTestId("stock-history").screenshot({ path: ".data/shots/history.png" });
await browser.close();
