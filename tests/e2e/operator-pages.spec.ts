// Every page an operator uses, on a 320 px phone and a 1440 px screen: tap targets of at least
// 44 x 44 CSS px (WCAG 2.2 2.5.5 and common mobile guidelines) and no serious or critical axe finding.
import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { demoEmail, signInPage } from "./support/auth";
import { demoIds } from "./support/db";

const SIZES = [
  { width: 320, height: 640 },
  { width: 1440, height: 900 },
];

/** Links, buttons and form fields a finger can hit that are smaller than 44 x 44 px. */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const el of document.querySelectorAll<HTMLElement>("a[href], button, input, select, textarea, summary")) {
      const r = el.getBoundingClientRect();
      // Hidden, or the skip link until focused.
      if (r.width <= 1 || r.height <= 1 || getComputedStyle(el).visibility === "hidden") continue;
      // A radio or checkbox counts with the label that wraps it.
      const hit = (el as HTMLInputElement).type === "radio" && el.closest("label") ? el.closest("label")! : el;
      const b = hit.getBoundingClientRect();
      if (b.width < 44 - 0.5 || b.height < 44 - 0.5)
        out.push(
          `${hit.tagName.toLowerCase()} "${(hit.textContent || hit.getAttribute("aria-label") || "").trim().slice(0, 30)}" ${Math.round(b.width)}x${Math.round(b.height)}`,
        );
    }
    return out;
  });
}

async function seriousViolations(page: Page): Promise<string[]> {
  const { violations } = await new AxeBuilder({ page }).analyze();
  return violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

async function pages(browser: Browser, size: { width: number; height: number }) {
  const ids = await demoIds();
  const anon = await browser.newContext({ viewport: size });
  const operator = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  const op = await operator.newPage();
  await signInPage(op, demoEmail("operator"));
  await op.setViewportSize(size);
  return {
    ids,
    anon,
    operator,
    op,
    list: [
      { who: anon, path: "/" },
      { who: anon, path: "/sign-in" },
      { who: anon, path: "/calculator" },
      { who: anon, path: `/v/${ids["token:pot"]}` },
      { who: anon, path: "/c/ZZZZ-ZZZZ" },
      { who: operator, path: "/calculator" },
      { who: operator, path: "/labs/demo/wall" },
      { who: operator, path: `/labs/demo/charts/${ids["chart:pot"]}/wall` },
      { who: operator, path: `/v/${ids["token:pot"]}/lab` },
    ],
  };
}

for (const size of SIZES) {
  test(`at ${size.width} px every operator page has 44 px targets and passes axe`, async ({ browser }) => {
    test.setTimeout(180_000);
    const { anon, operator, op, list } = await pages(browser, size);
    const anonPage = await anon.newPage();
    for (const { who, path } of list) {
      const page = who === anon ? anonPage : op;
      await page.goto(path);
      // Not "networkidle": the service worker may keep filling its cache in the background.
      await page.waitForLoadState("load");
      await expect(page.locator("main h1, main h2").first()).toBeVisible();
      // The phone menu's items count too.
      expect(await smallTargets(page), `${path} at ${size.width}`).toEqual([]);
      expect(await seriousViolations(page), `${path} at ${size.width}`).toEqual([]);
      if (size.width < 640) {
        const menu = page.getByRole("button", { name: "Menu" });
        if (await menu.count()) {
          await menu.click();
          expect(await smallTargets(page), `${path} menu`).toEqual([]);
          await page.keyboard.press("Escape");
        }
      }
    }
    await anon.close();
    await operator.close();
  });
}
