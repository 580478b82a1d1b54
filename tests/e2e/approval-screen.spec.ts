// The approval screen a medical lead can stand behind, walked by every role: a chart goes from
// draft to approved to superseded (and a last edition withdrawn). The screen shows every item the
// poster prints, lists a lab-rule breach with Approve off before any click, tells each edition's
// true state afterwards, and every approved edition's diff names the edition it replaced. Works on
// its own chart; the lab rules it changes are put back afterwards.
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { apiAs, demoEmail, signInPage } from "./support/auth";
import { demoIds, query } from "./support/db";

test.describe.configure({ mode: "serial" });

const title = `Approval screen chart ${Date.now().toString(36)}`;
const NOTES = "Illustrative notes for the approval screen test.";
const EXCEPTION = "Illustrative: the lab's own fitted exponent";
const state = { chartId: 0, ed: [0, 0, 0, 0, 0] as number[], rules: null as unknown };
let educator: APIRequestContext;
let lead: APIRequestContext;
let manager: APIRequestContext;

test.beforeAll(async ({ baseURL }) => {
  educator = await apiAs(baseURL!, "educator");
  lead = await apiAs(baseURL!, "lead");
  manager = await apiAs(baseURL!, "manager");
  const ids = await demoIds();
  const pot = await (await educator.get(`/api/v1/charts/${ids["chart:pot"]}`)).json();
  const made = await educator.post("/api/v1/labs/demo/charts", {
    data: { ...pot.definition, title, notes: NOTES, law: { law: "power", n: 2.5 } },
  });
  expect(made.status()).toBe(201);
  state.chartId = (await made.json()).id;
  // The lab allows every law but the power law for POT lookups: this chart breaks that rule.
  const { revision, ...rules } = await (await lead.get("/api/v1/labs/demo/rules")).json();
  state.rules = rules;
  const laws = ["finet", "murray", "huo-kassab", "square"];
  const put = await lead.put("/api/v1/labs/demo/rules", { data: { lookups: { proximal: { laws } }, revision } });
  expect(put.status()).toBe(200);
});

test.afterAll(async () => {
  if (state.rules) {
    const r = state.rules as Record<string, unknown>;
    await lead.put("/api/v1/labs/demo/rules", {
      data: {
        lookups: r.lookups,
        exceptions: r.exceptions,
        reviewPeriodMonths: r.reviewPeriodMonths,
        managersMayApprove: r.managersMayApprove,
      },
    });
  }
  await Promise.all([educator, lead, manager].map((c) => c?.dispose()));
});

async function newEdition(n: number, change?: Record<string, unknown>) {
  if (change) expect((await educator.patch(`/api/v1/charts/${state.chartId}`, { data: change })).status()).toBe(200);
  const r = await educator.post(`/api/v1/charts/${state.chartId}/editions`);
  expect(r.status()).toBe(201);
  const body = await r.json();
  expect(body.number).toBe(n);
  state.ed[n] = body.id;
}

const diffAgainst = async (api: APIRequestContext, n: number) =>
  (await (await api.get(`/api/v1/editions/${state.ed[n]}/diff`)).json()).against as number | null;

/** Each item the poster prints, in its words on the approval screen. */
async function expectPrintedItems(page: Page) {
  const item = (key: string) => page.getByTestId(`print-${key}`);
  await expect(item("law")).toContainText("Law: Power (n = 2.5): Dp^2.5 = Dmb^2.5 + Dsb^2.5");
  await expect(item("law")).toContainText("Parameter: exponent n = 2.5");
  await expect(item("family:proximal")).toContainText(/nominal [\d.]+ atm, RBP [\d.]+ atm/);
  await expect(item("family:proximal")).toContainText(
    /Nominal pressure [\d.]+ atm, rated burst pressure \(RBP\) [\d.]+ atm, (growth at RBP|no growth)/,
  );
  await expect(item("rounding:proximal")).toContainText("Balloon rounded up");
  await expect(item("caps")).toContainText(/more than [\d.]+ mm above the exact diameter/);
  await expect(item("stent")).toContainText(/Stent limit/);
  await expect(item("paper")).toContainText(/Printed on .+ (portrait|landscape), to be read from [\d.]+ m\./);
  await expect(item("paper")).toContainText(/′ of arc at [\d.]+ m/);
  await expect(item("legend")).toContainText("Stocked balloon: Large: the stocked balloon, mm.");
  await expect(item("notes")).toContainText(`Notes: ${NOTES}`);
  await expect(item("caution")).toContainText("CAUTION. Reference aid only.");
  await expect(item("exceptions")).toBeVisible();
  await expect(page.getByRole("link", { name: "Download the PDF" })).toHaveAttribute(
    "href",
    `/api/v1/editions/${await page.evaluate(() => location.pathname.split("/").pop())}/pdf`,
  );
  await expect(page.getByTestId("renderer-version")).toContainText(/renderer version \d+/);
}

/** Nothing runs off the screen sideways or is clipped inside the printed items and headings. */
async function expectNothingCut(page: Page, width: number) {
  await page.setViewportSize({ width, height: 900 });
  const problems = await page.evaluate(() => {
    const out: string[] = [];
    if (document.documentElement.scrollWidth > window.innerWidth + 1)
      out.push(`page ${document.documentElement.scrollWidth}px wide`);
    document
      .querySelectorAll("main h1, main h2, main h3, main p, main dd, main dt, main label, main li")
      .forEach((el) => {
        const e = el as HTMLElement;
        if (e.scrollWidth > e.clientWidth + 1 && getComputedStyle(e).overflowX !== "auto")
          out.push(`${e.tagName} "${e.textContent?.slice(0, 40)}" overflows`);
      });
    return out;
  });
  expect(problems, `at ${width} px`).toEqual([]);
}

test("educator: drafts edition 1 and sees what it prints, the breach, and no decision", async ({ page }) => {
  await newEdition(1);
  await signInPage(page, demoEmail("educator"));
  await page.goto(`/labs/demo/sign-off/${state.ed[1]}`);
  await expectPrintedItems(page);
  await expect(page.getByTestId("rule-breaches")).toContainText("not Power");
  await expect(page.getByRole("button", { name: /Approve edition/ })).toHaveCount(0);
});

test("medical lead: the breach is listed and Approve is off before any click; sends it back", async ({ page }) => {
  await signInPage(page, demoEmail("lead"));
  await page.goto(`/labs/demo/sign-off/${state.ed[1]}`);
  const approve = page.getByRole("button", { name: "Approve edition 1" });
  await expect(page.getByTestId("rule-breaches")).toContainText("1 breach without an exception");
  await expect(page.getByTestId("rule-breaches")).toContainText("not Power");
  await expect(approve).toBeDisabled();
  await expectPrintedItems(page);
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.screenshot({ path: ".data/reports/approval-breach-1440.png", fullPage: true });
  await expectNothingCut(page, 390);
  await page.screenshot({ path: ".data/reports/approval-breach-390.png", fullPage: true });
  await expectNothingCut(page, 320);
  await page.setViewportSize({ width: 1440, height: 900 });
  // Ticking the statement does not turn it on: the breach still has no exception.
  await page.getByLabel(/I have reviewed every changed cell/).check();
  await expect(approve).toBeDisabled();
  await page.getByLabel("Reason (the author reads it)").fill("The power law is not allowed for POT here");
  await page.getByRole("button", { name: "Send back" }).click();
  await expect(page.getByTestId("edition-state")).toContainText(
    "Edition 1 was sent back: it can no longer be approved. Reason: The power law is not allowed for POT here",
  );
});

test("medical lead: with the exception recorded, edition 2 shows it with its recorder; the lead who recorded it may not approve it, a manager does", async ({
  page,
  browser,
}) => {
  const { revision, exceptions } = await (await lead.get("/api/v1/labs/demo/rules")).json();
  const put = await lead.put("/api/v1/labs/demo/rules", {
    data: {
      exceptions: [...exceptions, { chartId: state.chartId, rule: "law", reason: EXCEPTION }],
      managersMayApprove: true,
      revision,
    },
  });
  expect(put.status()).toBe(200);
  await newEdition(2);
  await signInPage(page, demoEmail("lead"));
  await page.goto(`/labs/demo/sign-off/${state.ed[2]}`);
  await expect(page.getByTestId("rule-breaches")).toContainText("Lab rules: no breach");
  await expect(page.getByTestId("print-exceptions")).toContainText(`Exception to the lab rule “law”: ${EXCEPTION}`);
  await expect(page.getByTestId("print-exceptions")).toContainText("“law” recorded by");
  await expectPrintedItems(page);
  await page.getByLabel(/I have reviewed every changed cell/).check();
  await page.getByRole("button", { name: "Approve edition 2" }).click();
  // Four eyes: the exception the lead recorded is a change to what this edition prints.
  await expect(page.getByRole("alert").filter({ hasText: "four eyes" })).toContainText("exceptions for this chart");

  const ctx = await browser.newContext();
  const mp = await ctx.newPage();
  await signInPage(mp, demoEmail("manager"));
  await mp.goto(`/labs/demo/sign-off/${state.ed[2]}`);
  await mp.getByLabel(/I have reviewed every changed cell/).check();
  await mp.getByRole("button", { name: "Approve edition 2" }).click();
  await expect(mp.getByTestId("edition-state")).toContainText(
    /Edition 2 is approved by .+ It replaced no earlier edition\./,
  );
  await ctx.close();
  expect(await diffAgainst(lead, 2)).toBeNull();
});

test("medical lead: edition 3 shows changed items outlined like cells, is approved, and names edition 2", async ({
  page,
}) => {
  await newEdition(3, { notes: `${NOTES} Revised.` });
  await signInPage(page, demoEmail("lead"));
  await page.goto(`/labs/demo/sign-off/${state.ed[3]}`);
  await expect(page.getByTestId("diff-summary")).toContainText("Compared with edition 2");
  await expect(page.getByTestId("print-notes")).toHaveAttribute("data-changed", "true");
  await expect(page.getByTestId("print-notes")).toContainText("◆");
  await expect(page.getByTestId("print-law")).not.toHaveAttribute("data-changed", "true");
  await page.getByLabel(/I have reviewed every changed cell/).check();
  await page.getByRole("button", { name: "Approve edition 3" }).click();
  await expect(page.getByTestId("edition-state")).toContainText(/Edition 3 is approved .+ It replaced edition 2\./);
  await expect(page.getByTestId("diff-summary")).toContainText("which this edition replaced");
  await page.screenshot({ path: ".data/reports/approval-approved-1440.png", fullPage: true });
  await expectNothingCut(page, 390);
  await page.screenshot({ path: ".data/reports/approval-approved-390.png", fullPage: true });
  expect(await diffAgainst(lead, 3)).toBe(state.ed[2]);
});

test("manager: edition 4 supersedes 3, whose diff still names 2; the chart's history opens each diff; withdraws 4", async ({
  page,
}) => {
  await newEdition(4, { notes: `${NOTES} Revised again.` });
  expect((await lead.post(`/api/v1/editions/${state.ed[4]}/approve`, { data: { reviewed: true } })).status()).toBe(200);
  const [row] = await query<{ s: string }>("SELECT status AS s FROM editions WHERE id = ?", [state.ed[3]]);
  expect(row!.s).toBe("superseded");
  expect(await diffAgainst(manager, 3)).toBe(state.ed[2]);
  expect(await diffAgainst(manager, 4)).toBe(state.ed[3]);

  await signInPage(page, demoEmail("manager"));
  await page.goto(`/labs/demo/charts/${state.chartId}`);
  const history = page.getByTestId("edition-history");
  await expect(history.getByTestId("history-3")).toContainText("Against edition 2: 0 printed cells changed");
  await expect(history.getByTestId("history-3")).toContainText(/printed items changed: .*Notes/);
  await expect(history.getByTestId("history-2")).toContainText("approved by");
  await history.getByRole("link", { name: "Edition 3: what it changed" }).click();
  await expect(page).toHaveURL(new RegExp(`/labs/demo/sign-off/${state.ed[3]}$`));
  await expect(page.getByTestId("edition-state")).toContainText("superseded by a newer edition");
  await expect(page.getByTestId("edition-state")).toContainText("It replaced edition 2.");

  const w = await manager.post(`/api/v1/editions/${state.ed[4]}/withdraw`, {
    data: { reason: "Printed on the wrong paper" },
  });
  expect(w.status()).toBe(200);
  await page.goto(`/labs/demo/sign-off/${state.ed[4]}`);
  await expect(page.getByTestId("edition-state")).toContainText(
    /Edition 4 was withdrawn on .+ Reason: Printed on the wrong paper/,
  );
});

test("operator: reads what an approved edition printed, with no decision to make", async ({ page }) => {
  await signInPage(page, demoEmail("operator"));
  await page.goto(`/labs/demo/sign-off/${state.ed[3]}`);
  await expectPrintedItems(page);
  await expect(page.getByTestId("print-exceptions")).toContainText(EXCEPTION);
  await expect(page.getByRole("button", { name: /Approve/ })).toHaveCount(0);
  await expect(page.getByTestId("rule-breaches")).toHaveCount(0);
});
