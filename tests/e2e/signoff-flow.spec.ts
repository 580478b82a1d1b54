// The sign-off loop, one step per role, in a browser: the educator creates an edition, the
// medical lead reviews the highlighted diff in the queue and approves, the manager's wall copy
// reads replace and then keep once the new edition hangs, a notes-only change leaves copies
// current (and names the reworded edition), a withdrawal turns older copies to take-down, and an
// archived chart leaves the lists. Works on its own chart and room, so the demo's charts stay as seeded.
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { apiAs, demoEmail, signInPage } from "./support/auth";
import { demoIds, query } from "./support/db";
import { mailTo } from "../support/mail";
import type { Role } from "../support/roles";

test.describe.configure({ mode: "serial" });

const title = `Sign-off flow chart ${Date.now().toString(36)}`;
const state = { chartId: 0, roomId: 0, ed1: 0, ed2: 0, ed3: 0, posting1: 0, posting2: 0 };
const roomName = `Sign-off room ${Date.now()}`;

/** Waits for an e-mail to `role` whose subject (and text, when given) match, through the local SMTP fake. */
async function expectMail(role: Role, subject: RegExp, text?: string) {
  await expect
    .poll(
      async () =>
        (await mailTo(demoEmail(role))).some((m) => subject.test(m.subject) && (!text || m.text.includes(text))),
      { message: `e-mail to the ${role}: ${subject}`, timeout: 20_000 },
    )
    .toBe(true);
}
const quoted = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
let educator: APIRequestContext;
let manager: APIRequestContext;

test.beforeAll(async ({ baseURL }) => {
  educator = await apiAs(baseURL!, "educator");
  manager = await apiAs(baseURL!, "manager");
  const ids = await demoIds();
  const pot = await (await educator.get(`/api/v1/charts/${ids["chart:pot"]}`)).json();
  const made = await educator.post("/api/v1/labs/demo/charts", { data: { ...pot.definition, title } });
  expect(made.status()).toBe(201);
  state.chartId = (await made.json()).id;
  const room = await manager.post("/api/v1/labs/demo/rooms", { data: { name: roomName } });
  expect(room.status()).toBe(201);
  state.roomId = (await room.json()).id;
});

test.afterAll(async () => {
  await educator?.dispose();
  await manager?.dispose();
});

const tokenOf = async (editionId: number) =>
  (await query<{ t: string }>("SELECT check_token AS t FROM editions WHERE id = ?", [editionId]))[0]!.t;

async function expectCheck(page: Page, editionId: number, status: string, action: string) {
  await page.goto(`/v/${await tokenOf(editionId)}`);
  await expect(page.getByTestId("check-status")).toHaveAttribute("data-status", status);
  await expect(page.getByTestId("check-action")).toHaveAttribute("data-action", action);
}

async function createEditionInDesigner(page: Page, number: number) {
  await page.goto(`/labs/demo/charts/${state.chartId}`);
  await page.getByRole("button", { name: "Create edition" }).click();
  await expect(page.getByText(`Edition ${number} created as a draft.`)).toBeVisible();
  const [row] = await query<{ id: number }>("SELECT id FROM editions WHERE chart_id = ? AND number = ?", [
    state.chartId,
    number,
  ]);
  return Number(row!.id);
}

async function approveFromQueue(page: Page, editionId: number, number: number) {
  await page.goto("/labs/demo");
  await page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Sign-off" }).click();
  await expect(page.getByRole("heading", { name: "Waiting for sign-off" })).toBeVisible();
  const item = page.getByTestId("queue-item").filter({ hasText: `${title} — edition ${number}` });
  await expect(item).toContainText("Drafted by");
  await expect(item).toContainText("waiting");
  await item.getByRole("link").click();
  await expect(page).toHaveURL(new RegExp(`/labs/demo/sign-off/${editionId}$`));
  const approve = page.getByRole("button", { name: `Approve edition ${number}` });
  await expect(approve).toBeDisabled();
  await page.getByLabel(/I have reviewed every changed cell/).check();
  await approve.click();
  // The confirmation, or the page as it reads once the approval has refreshed it.
  await expect(page.getByText(new RegExp(`^Edition ${number} (approved\\.|is approved)`))).toBeVisible({
    timeout: 30_000,
  });
}

test("educator: creates the first edition of a chart from the designer", async ({ page }) => {
  await signInPage(page, demoEmail("educator"));
  state.ed1 = await createEditionInDesigner(page, 1);
  // The medical lead, who may approve, is told it waits.
  await expectMail("lead", new RegExp(`Edition 1 of "${quoted(title)}" is waiting for sign-off`));
  // The educator may not approve: no Sign-off tab, and the queue page says so.
  await expect(page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Sign-off" })).toHaveCount(0);
  await page.goto("/labs/demo/sign-off");
  await expect(page.getByRole("heading", { name: "Not available for your role" })).toBeVisible();
});

test("medical lead: the queue lists it oldest first; every cell is new; approves with the review statement", async ({
  page,
}) => {
  await signInPage(page, demoEmail("lead"));
  await page.goto("/labs/demo/sign-off");
  // The seeded draft waited longer, so it comes first.
  const items = page.getByTestId("queue-item");
  const texts = await items.allTextContents();
  const mine = texts.findIndex((t) => t.includes(title));
  expect(mine).toBeGreaterThan(0);
  await page.goto(`/labs/demo/sign-off/${state.ed1}`);
  await expect(page.getByTestId("diff-summary")).toContainText("No approved edition of this chart exists yet");
  const diff = await (await page.request.get(`/api/v1/editions/${state.ed1}/diff`)).json();
  expect(diff.against).toBeNull();
  await expect(page.locator('[data-testid="diff-grid-after-proximal"] td[data-changed="true"]')).toHaveCount(
    diff.cells.length,
  );
  await approveFromQueue(page, state.ed1, 1);
  // Its author hears that it was approved.
  await expectMail("educator", new RegExp(`Edition 1 of "${quoted(title)}" was approved`));
});

test("manager: hangs edition 1; after edition 2 is approved the copy reads replace, the new copy keep", async ({
  page,
  browser,
}) => {
  // Three people's sessions and full-page screenshots of the whole approval screen at three widths.
  test.slow();
  const posted = await manager.post(`/api/v1/editions/${state.ed1}/postings`, { data: { roomId: state.roomId } });
  expect(posted.status()).toBe(201);
  state.posting1 = (await posted.json()).id;
  await expectCheck(page, state.ed1, "current", "keep");

  // The educator adds a row (a clinical change) and creates edition 2 ...
  const pot = await (await educator.get(`/api/v1/charts/${state.chartId}`)).json();
  const lookup = pot.definition.lookups[0];
  // One more row below the last (rows are a range or a list of values).
  const rows: number[] | { from: number; to: number; step: number } = lookup.rows;
  const last = Array.isArray(rows) ? rows.at(-1)! : rows.to;
  const newRow = Math.round((last + 0.25) * 100) / 100;
  const grown = { ...lookup, rows: Array.isArray(rows) ? [...rows, newRow] : { ...rows, to: newRow } };
  expect((await educator.patch(`/api/v1/charts/${state.chartId}`, { data: { lookups: [grown] } })).status()).toBe(200);
  const eduContext = await browser.newContext();
  const eduPage = await eduContext.newPage();
  await signInPage(eduPage, demoEmail("educator"));
  state.ed2 = await createEditionInDesigner(eduPage, 2);
  await eduContext.close();

  // ... the lead sees exactly the new row highlighted beside edition 1, and approves.
  const leadContext = await browser.newContext();
  const leadPage = await leadContext.newPage();
  await signInPage(leadPage, demoEmail("lead"));
  await leadPage.goto(`/labs/demo/sign-off/${state.ed2}`);
  await expect(leadPage.getByTestId("diff-summary")).toContainText("Compared with edition 1");
  const diff = await (await leadPage.request.get(`/api/v1/editions/${state.ed2}/diff`)).json();
  expect(diff.against).toBe(state.ed1);
  expect(diff.cells.length).toBeGreaterThan(0);
  expect(diff.cells.every((c: { row: number }) => c.row === newRow)).toBe(true);
  const changed = leadPage.locator('[data-testid="diff-grid-after-proximal"] td[data-changed="true"]');
  await expect(changed).toHaveCount(diff.cells.length);
  await expect(changed.first()).toContainText("Changed.");
  await expect(changed.first()).toContainText("◆");
  await expect(leadPage.getByTestId("diff-list").getByRole("listitem")).toHaveCount(diff.cells.length);
  await expect(leadPage.getByTestId("diff-list")).toContainText("not printed →");
  // What the lead sees, at a desktop and two phone widths, with no sideways page scroll.
  for (const width of [1440, 390, 320]) {
    await leadPage.setViewportSize({ width, height: 900 });
    const overflow = await leadPage.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow, `review page at ${width} px`).toBeLessThanOrEqual(0);
    await leadPage.screenshot({ path: `.data/reports/sign-off-review-${width}.png`, fullPage: true });
  }
  await leadPage.setViewportSize({ width: 1280, height: 900 });
  await approveFromQueue(leadPage, state.ed2, 2);
  await leadContext.close();

  await expectCheck(page, state.ed1, "superseded", "replace");
  await expect(page.getByTestId("check-action")).toContainText("edition 2");
  // The manager's digest, after the quiet period, names the room whose copy to replace.
  await expectMail("manager", /wall printouts? to replace/, roomName);
  // The manager hangs edition 2 and takes edition 1 down: the copy on the wall reads keep.
  const posted2 = await manager.post(`/api/v1/editions/${state.ed2}/postings`, { data: { roomId: state.roomId } });
  expect(posted2.status()).toBe(201);
  state.posting2 = (await posted2.json()).id;
  expect((await manager.delete(`/api/v1/labs/demo/postings/${state.posting1}`)).status()).toBe(204);
  await expectCheck(page, state.ed2, "current", "keep");
});

test("a notes-only change leaves the posted copy current and names the reworded edition", async ({ page }) => {
  const patched = await educator.patch(`/api/v1/charts/${state.chartId}`, {
    data: { notes: "Reworded notes: measure at the reference segments." },
  });
  expect(patched.status()).toBe(200);
  await expectCheck(page, state.ed2, "current", "keep");
  const check = await (await page.request.get(`/api/v1/check/${await tokenOf(state.ed2)}`)).json();
  expect(check).toMatchObject({ status: "current", action: "keep", reworded: false });

  const made = await educator.post(`/api/v1/charts/${state.chartId}/editions`, { data: {} });
  expect(made.status()).toBe(201);
  state.ed3 = (await made.json()).id;
  await expectCheck(page, state.ed2, "current", "keep");
  await expect(page.getByTestId("check-reworded")).toContainText("edition 3, waiting for sign-off");
  const after = await (await page.request.get(`/api/v1/check/${await tokenOf(state.ed2)}`)).json();
  expect(after).toMatchObject({ reworded: true, rewordedEdition: { number: 3, status: "draft" } });
  expect(after.changes).toEqual([]);
  // The reworded draft changes no printed cell.
  const diff = await (await educator.get(`/api/v1/editions/${state.ed3}/diff`)).json();
  expect(diff).toEqual({ against: state.ed2, cells: [] });
});

test("manager: withdrawing the current edition turns every copy of the chart to take-down", async ({ page }) => {
  await signInPage(page, demoEmail("manager"));
  await page.goto(`/labs/demo/charts/${state.chartId}`);
  await page.getByTestId("edition-2").getByRole("button", { name: "Withdraw" }).click();
  const ask = page.getByRole("dialog", { name: "Withdraw edition 2?" });
  await expect(ask.getByRole("button", { name: "Withdraw edition" })).toBeDisabled();
  await ask.getByLabel(/Why is it withdrawn/).fill("Wrong rows for this room");
  await ask.getByRole("button", { name: "Withdraw edition" }).click();
  await expect(page.getByText("Edition 2 withdrawn.")).toBeVisible();
  await expectCheck(page, state.ed2, "withdrawn", "take-down");
  await expectCheck(page, state.ed1, "superseded", "take-down");
});

test("medical lead: archives the chart with a confirmation; it leaves the list and its copies read take-down; restoring undoes it", async ({
  page,
}) => {
  await signInPage(page, demoEmail("lead"));
  await page.goto(`/labs/demo/charts/${state.chartId}`);
  await page.getByRole("button", { name: "Archive chart…" }).click();
  await page.getByRole("button", { name: "Yes, archive it" }).click();
  // The page refreshes into its archived state: a banner, and no archive or create-edition button.
  await expect(page.getByRole("status").filter({ hasText: /Archived on \d{4}-\d{2}-\d{2}/ })).toBeVisible();
  await expect(page.getByRole("button", { name: "Archive chart…" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: "Create edition" })).toHaveCount(0);
  await page.goto("/labs/demo/charts");
  await expect(page.getByRole("link", { name: title })).toHaveCount(0);
  await page.getByRole("link", { name: "Archived charts" }).click();
  await expect(page.getByRole("link", { name: title })).toBeVisible();
  await expectCheck(page, state.ed2, "withdrawn", "take-down");
  // The reworded draft of an archived chart no longer waits for sign-off.
  await page.goto("/labs/demo/sign-off");
  await expect(page.getByTestId("queue-item").filter({ hasText: title })).toHaveCount(0);
  // Restored on a phone: the outcome stays on screen while the panel turns back into "Archive".
  await page.setViewportSize({ width: 320, height: 800 });
  await page.goto(`/labs/demo/charts/${state.chartId}`);
  await page.getByRole("button", { name: "Restore chart" }).click();
  await expect(page.getByRole("status").filter({ hasText: "is restored" })).toBeVisible();
  await expect(page.getByRole("button", { name: "Archive chart…" })).toBeVisible();
  await expect(page.getByRole("status").filter({ hasText: /Archived on/ })).toHaveCount(0);
});

test("operator: no Sign-off tab and no approval; the review page reads without controls", async ({ page }) => {
  await signInPage(page, demoEmail("operator"));
  await page.goto("/labs/demo");
  await expect(page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Sign-off" })).toHaveCount(0);
  await page.goto(`/labs/demo/sign-off/${state.ed3}`);
  await expect(page.getByRole("button", { name: /Approve edition/ })).toHaveCount(0);
});

test("the queue and a review page fit 1440, 390 and 320 px without a sideways page scroll", async ({ page }) => {
  await signInPage(page, demoEmail("lead"));
  const ids = await demoIds();
  for (const width of [1440, 390, 320]) {
    await page.setViewportSize({ width, height: 900 });
    for (const path of ["/labs/demo/sign-off", `/labs/demo/sign-off/${ids["edition:draft"]}`]) {
      await page.goto(path);
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow, `${path} at ${width} px`).toBeLessThanOrEqual(0);
    }
    await page.goto("/labs/demo/sign-off");
    await page.screenshot({ path: `.data/reports/sign-off-queue-${width}.png`, fullPage: true });
  }
});
