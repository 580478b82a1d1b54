import { chromium } from "@playwright/test";
const [,, email, path, out, sel, w] = process.argv;
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--disable-dev-shm-usage"] });
const page = await browser.newPage({ viewport: { width: Number(w ?? 1280), height: 900 } });
const base = "http://localhost:3030";
if (email !== "none") {
  await page.goto(base + "/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("forkwall-demo-2026");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/dashboard/);
}
await page.goto(base + path);
await page.waitForTimeout(1000);
if (sel && sel !== "full") await page.locator(sel).first().screenshot({ path: out });
else await page.screenshot({ path: out, fullPage: sel === "full" });
await browser.close();
