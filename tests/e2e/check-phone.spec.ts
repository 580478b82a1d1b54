// The check page on a phone: every status fits a 320 px screen with no sideways scrolling and
// says what to do; a replaced copy lists the cells that differ with both values; an outdated copy
// nothing replaces strikes its affected cells and names whom to ask; unknown codes are a 404.
import { execFileSync } from "node:child_process";
import { expect, test, type Page } from "@playwright/test";
import { parseShortCode } from "@/lib/editions/short-code";
import { jsqrDecode, rasterise } from "../support/pdf-tools";
import { demoEmail, signInApi, signInPage } from "./support/auth";
import { makeCheckFixtures, type CheckFixtures } from "./support/check-fixtures";
import { demoIds, query } from "./support/db";

let fx: CheckFixtures;
test.beforeAll(async () => {
  fx = await makeCheckFixtures();
});

const SIZES = [
  { width: 320, height: 640 },
  { width: 390, height: 844 },
];

async function noSidewaysScroll(page: Page) {
  const widths = await page.evaluate(() => ({
    doc: document.documentElement.scrollWidth,
    body: document.body.scrollWidth,
    view: window.innerWidth,
  }));
  expect(widths.doc, JSON.stringify(widths)).toBeLessThanOrEqual(widths.view);
  expect(widths.body, JSON.stringify(widths)).toBeLessThanOrEqual(widths.view);
}

for (const size of SIZES) {
  test(`at ${size.width}x${size.height} every status fits and says what to do`, async ({ browser }) => {
    const context = await browser.newContext({ viewport: size, javaScriptEnabled: false });
    const page = await context.newPage();
    const want = {
      current: ["Current", "keep", "Keep this copy"],
      review: ["Current", "review", "Have this copy reviewed"],
      outdated: ["Outdated", "take-down", "Take this copy down"],
      superseded: ["Superseded", "replace", "Replace this copy"],
      withdrawn: ["Withdrawn", "replace", "Replace this copy"],
      draft: ["Draft - not for clinical use", "replace", "Replace this copy"],
    } as const;
    const looks = new Map<string, string>();
    for (const [name, [word, action, heading]] of Object.entries(want)) {
      const f = fx[name as keyof typeof want];
      const res = await page.goto(`/v/${f.token}`);
      expect(res?.status(), name).toBe(200);
      // The action comes first: the page's first heading, above the status.
      await expect(page.getByRole("heading").first()).toHaveText(heading);
      expect(await page.locator("h1").count(), name).toBe(1);
      const verdict = page.getByTestId("check-verdict");
      const box = await verdict.boundingBox();
      const status = await page.getByTestId("check-status").boundingBox();
      expect(box!.y, name).toBeLessThan(status!.y);
      expect(box!.y + box!.height, `${name}: the action is on the first screen`).toBeLessThanOrEqual(size.height);
      // One look per action, the same whatever the status.
      const look = await verdict.evaluate((el) => {
        const c = getComputedStyle(el);
        return `${c.borderTopStyle} ${c.borderTopColor} ${c.backgroundColor}`;
      });
      if (looks.has(action)) expect(look, name).toBe(looks.get(action));
      else {
        expect([...looks.values()], name).not.toContain(look);
        looks.set(action, look);
      }
      // Nothing on the check page is set under 16 px.
      const smallest = await page.evaluate(() =>
        Math.min(
          ...[...document.body.querySelectorAll("*")]
            .filter((el) => [...el.childNodes].some((n) => n.nodeType === 3 && n.textContent!.trim()))
            .map((el) => parseFloat(getComputedStyle(el).fontSize)),
        ),
      );
      expect(smallest, name).toBeGreaterThanOrEqual(16);
      await expect(page.getByTestId("check-warning")).toHaveCount(name === "withdrawn" || name === "draft" ? 1 : 0);
      await expect(page.getByTestId("check-status")).toContainText(word);
      await expect(page.getByTestId("check-action")).toHaveAttribute("data-action", action);
      await expect(page.getByTestId("check-date")).toHaveText(/^\w[\w ]+ \d{4}-\d{2}-\d{2}$/);
      await expect(page.getByTestId("check-code")).toHaveText(`${f.shortCode.slice(0, 4)}-${f.shortCode.slice(4)}`);
      await expect(page.getByRole("note", { name: "Clinical caution" })).toBeVisible();
      await noSidewaysScroll(page);
      // The status word is shown whole: its box is not clipping it.
      const clipped = await page
        .getByTestId("check-verdict")
        .locator("h1")
        .last()
        .evaluate((el) => el.scrollWidth > el.clientWidth + 1);
      expect(clipped, `${name}: status word clipped`).toBe(false);
    }
    await context.close();
  });
}

test("a replaced copy lists each differing cell with this copy's value and the new edition's", async ({ page }) => {
  await page.goto(`/v/${fx.superseded.token}`);
  await expect(page.getByTestId("check-action")).toContainText(`edition ${fx.replacementNumber}`);
  const cells = page.getByTestId("check-cells");
  await expect(cells).toHaveAttribute("data-kind", "replace");
  const first = cells.getByRole("listitem").first();
  await expect(first).toContainText(/Main branch \d\.\d+ mm × side branch \d\.\d+ mm/);
  await expect(first.locator("del")).toHaveText(/^3\.6 mm/);
  await expect(first.locator("b")).toHaveText(/^3\.75 mm/);
  await expect(page.getByTestId("check-action")).not.toContainText("ask");
});

test("an outdated copy with no approved replacement strikes its affected cells and names whom to ask", async ({
  page,
}) => {
  await query("UPDATE labs SET contact_line = NULL WHERE slug = ?", [fx.labSlug]);
  await page.goto(`/v/${fx.outdated.token}`);
  await expect(page.getByTestId("check-action")).toHaveAttribute("data-action", "take-down");
  const cells = page.getByTestId("check-cells");
  await expect(cells).toHaveAttribute("data-kind", "affected");
  await expect(cells.locator("del").first()).toHaveText(/^3\.6 mm/);
  // Never a number no one approved: today's values are not shown.
  await expect(cells.locator("b")).toHaveCount(0);
  await expect(cells).not.toContainText("3.75");
  await expect(page.getByTestId("check-action")).toHaveText("No approved replacement yet: ask the lab's manager.");
  // One person to ask, said once.
  expect(await page.locator("main").innerText()).not.toMatch(/medical lead|ask[\s\S]*ask/);
  await query("UPDATE labs SET contact_line = ? WHERE slug = ?", [
    "ask the charge nurse in the control room",
    fx.labSlug,
  ]);
  try {
    await page.reload();
    await expect(page.getByTestId("check-action")).toHaveText(
      "No approved replacement yet: ask the charge nurse in the control room.",
    );
  } finally {
    await query("UPDATE labs SET contact_line = NULL WHERE slug = ?", [fx.labSlug]);
  }
});

test("dates are shown in the lab's time zone", async ({ page }) => {
  await query("UPDATE labs SET time_zone = ? WHERE slug = ?", ["Pacific/Auckland", fx.labSlug]);
  try {
    await page.goto(`/v/${fx.superseded.token}`);
    // Superseded 2026-11-25 09:00 UTC is 22:00 the same day in Auckland (UTC+13).
    await expect(page.getByTestId("check-date")).toHaveText("Since 2026-11-25");
    await page.goto(`/v/${fx.current.token}`);
    await expect(page.getByTestId("check-date")).toHaveText("Approved 2026-11-20");
    await query("UPDATE labs SET time_zone = ? WHERE slug = ?", ["Pacific/Kiritimati", fx.labSlug]);
    // UTC+14: 2026-11-20 09:00 UTC is 23:00 that day; review-by 2026-01-01 00:00 UTC is 14:00 on 1 January.
    await page.goto(`/v/${fx.review.token}`);
    await expect(page.getByTestId("check-action")).toContainText("2026-01-01");
  } finally {
    await query("UPDATE labs SET time_zone = ? WHERE slug = ?", ["UTC", fx.labSlug]);
  }
});

test("a member's check page shows its dates in the lab's time zone too", async ({ page }) => {
  // Etc/GMT+12 is UTC-12: approved 2026-11-20 09:00 UTC is the evening of 19 November there.
  await query("UPDATE labs SET time_zone = ? WHERE slug = ?", ["Etc/GMT+12", fx.labSlug]);
  await query(
    `INSERT INTO memberships (lab_id, user_id, role)
     SELECT l.id, u.id, 'operator' FROM labs l, users u WHERE l.slug = ? AND u.email = ?`,
    [fx.labSlug, demoEmail("operator")],
  );
  try {
    await signInPage(page, demoEmail("operator"), undefined, `/v/${fx.current.token}/lab`);
    await page.goto(`/v/${fx.current.token}`);
    await expect(page).toHaveURL(new RegExp(`/v/${fx.current.token}/lab$`));
    await expect(page.getByTestId("check-status")).toContainText("Approved 2026-11-19");
  } finally {
    await query(
      `DELETE m FROM memberships m JOIN labs l ON l.id = m.lab_id JOIN users u ON u.id = m.user_id
       WHERE l.slug = ? AND u.email = ?`,
      [fx.labSlug, demoEmail("operator")],
    );
    await query("UPDATE labs SET time_zone = ? WHERE slug = ?", ["UTC", fx.labSlug]);
  }
});

test("unknown and malformed tokens and codes say no printout has this code and offer the field again", async ({
  page,
}) => {
  for (const path of [
    "/v/AAAAAAAAAAAAAAAAAAAAAAAA",
    "/v/short",
    "/v/%27%3B--%20drop",
    "/c/ZZZZ-ZZZZ",
    "/c/not-a-code-at-all",
    "/c/U!",
  ]) {
    const res = await page.goto(path);
    expect(res?.status(), path).toBe(404);
    await expect(page.getByRole("heading").first()).toHaveText("No printout has this code");
    // A typing slip is not a forgery.
    await expect(page.locator("main")).not.toContainText(/do not rely|forg|unverified/i);
    await expect(page.getByLabel("Code under the QR code on the printout")).toBeVisible();
  }
  // Typed again, correctly this time, it leads to the copy's page.
  await page.getByLabel("Code under the QR code on the printout").fill(fx.current.shortCode.toLowerCase());
  await page.getByRole("button", { name: "Check" }).click();
  await expect(page).toHaveURL(new RegExp(`/v/${fx.current.token}$`));
  await expect(page.getByRole("heading").first()).toHaveText("Keep this copy");
});

test("a typed short code, in any case and with look-alike letters, leads to the check page", async ({ page }) => {
  const code = fx.current.shortCode;
  const typed = `${code.slice(0, 4).toLowerCase()} ${code.slice(4)}`.replace(/1/g, "l").replace(/0/g, "o");
  const res = await page.goto(`/c/${encodeURIComponent(typed)}`);
  expect(res?.status()).toBe(200);
  expect(new URL(page.url()).pathname).toBe(`/v/${fx.current.token}`);
  await expect(page.getByTestId("check-status")).toHaveAttribute("data-status", "current");
  expect((await demoIds())["token:pot"]).toBeTruthy();
});

/** The short code a poster prints, read from its text layer with poppler's pdftotext: the code in the printed address `<host>/c/<code>`. */
function shortCodeInText(text: string): string | null {
  const inUrl = /\/c\/([0-9A-Za-z]{4}-?[0-9A-Za-z]{4})/.exec(text.replace(/\s+/g, ""))?.[1];
  return parseShortCode(inUrl ?? "");
}

test("the short code printed on a poster leads to the same check page as its QR code", async ({
  playwright,
  baseURL,
  page,
}) => {
  const ids = await demoIds();
  const member = await playwright.request.newContext({ baseURL });
  await signInApi(member, demoEmail("manager"));
  const res = await member.get(`/api/v1/editions/${ids["edition:pot"]}/pdf`);
  expect(res.status()).toBe(200);
  const pdf = Buffer.from(await res.body());
  await member.dispose();
  const qrUrl = jsqrDecode(rasterise(pdf, 100))?.text;
  expect(qrUrl).toBe(`${baseURL}/v/${ids["token:pot"]}`);
  const text = execFileSync("pdftotext", ["-layout", "-", "-"], { input: pdf }).toString("utf8");
  const code = shortCodeInText(text);
  const [stored] = await query<{ c: string }>("SELECT short_code AS c FROM editions WHERE id = ?", [
    ids["edition:pot"],
  ]);
  expect(code, "the short address printed under the QR code").toBe(stored!.c);
  await page.goto(`/c/${code}`);
  expect(page.url()).toBe(qrUrl);
  await expect(page.getByTestId("check-status")).toHaveAttribute("data-status", "current");
  await expect(page.getByTestId("check-code")).toHaveText(`${code!.slice(0, 4)}-${code!.slice(4)}`);
});

test("an anonymous scan, answered ahead of Next, is the page and headers Next gives a signed-in visitor", async ({
  playwright,
}) => {
  // server.mjs answers cookie-less scans itself (lib/http/direct.ts); any session cookie, even
  // one that is not valid, sends the request through Next's route handler instead.
  const direct = await playwright.request.newContext({ baseURL: test.info().project.use.baseURL });
  const viaNext = await playwright.request.newContext({
    baseURL: test.info().project.use.baseURL,
    extraHTTPHeaders: { cookie: "authjs.session-token=not-a-session" },
  });
  const SAME = [
    "content-type",
    "cache-control",
    "content-security-policy",
    "x-content-type-options",
    "referrer-policy",
    "x-frame-options",
    "permissions-policy",
  ];
  for (const path of [`/v/${fx.current.token}`, `/v/${fx.outdated.token}`, "/v/not-a-poster-token-at-all"]) {
    const a = await direct.get(path, { headers: { "accept-encoding": "gzip" } });
    const b = await viaNext.get(path, { headers: { "accept-encoding": "gzip" } });
    expect(a.status(), path).toBe(b.status());
    expect(await a.text(), path).toBe(await b.text());
    for (const h of SAME) expect(a.headers()[h], `${path} ${h}`).toBe(b.headers()[h]);
    expect(a.headers()["content-security-policy"]).toContain("frame-ancestors 'none'");
    const head = await direct.head(path);
    expect(head.status()).toBe(a.status());
    expect((await head.body()).length).toBe(0);
  }
  const code = await direct.get(`/c/${fx.current.shortCode.toLowerCase()}`, { maxRedirects: 0 });
  expect(code.status()).toBe(303);
  expect(code.headers()["location"]).toBe(`/v/${fx.current.token}`);
  expect(code.headers()["x-frame-options"]).toBe("DENY");
  await direct.dispose();
  await viaNext.dispose();
});
