// A lab ready from sign-up to a posted copy, with all stock from one CSV file: the walk counts
// the manager's and the lead's clicks and typed fields after sign-up (the CSV itself excluded)
// and prints them, and every page on the way is read for counts phrased wrongly ("1 sizes").
import { readFileSync } from "node:fs";
import { expect, test, type Locator, type Page } from "@playwright/test";
import { closeDb, query, uniqueEmail } from "./support/db";
import { linkIn, waitForMail } from "../support/mail";

test.afterAll(closeDb);

const PASSWORD = "a long enough phrase";
const CSV = readFileSync("public/examples/stock-example.csv", "utf8");

/** Wording that string joins produce and plural rules do not. */
const BAD_WORDS = [
  /\b1 (sizes|families|charts|copies|rooms|printouts|people|members|editions|lines|platforms)\b/,
  /\b(No|\d+) an? (medical lead|educator|manager|operator)\b/,
  /\b(0|[2-9]|\d{2,}) (size|family|chart|copy|room|printout|person|member|edition|platform)\b(?![- ])/,
];

function counter() {
  const n = { clicks: 0, fields: 0 };
  return {
    n,
    click: async (l: Locator) => {
      n.clicks += 1;
      await l.click();
    },
    fill: async (l: Locator, value: string) => {
      n.fields += 1;
      await l.fill(value);
    },
    select: async (l: Locator, option: { label: string }) => {
      n.clicks += 1;
      await l.selectOption(option);
    },
  };
}

async function sweep(page: Page, seen: Set<string>) {
  const text = (await page.locator("body").innerText()).replace(/\s+/g, " ");
  for (const bad of BAD_WORDS) expect(text, `${page.url()}`).not.toMatch(bad);
  seen.add(new URL(page.url()).pathname);
}

test("a manager goes from sign-up to a posted copy with the CSV import, in few clicks and fields", async ({
  browser,
}) => {
  test.setTimeout(240_000);
  const stamp = Date.now().toString(36);
  const email = uniqueEmail("ready");
  const leadEmail = uniqueEmail("ready-lead");
  const seen = new Set<string>();
  const ctx = await browser.newContext();
  const page = await ctx.newPage();

  // Sign up from the home page (not counted: the person's own details).
  await page.goto("/");
  await page.getByRole("link", { name: "Create an account and a lab" }).click();
  await page.getByLabel("Your name").fill("Dr Ines Calder (e2e)");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page).toHaveURL(/\/check-email/);
  await page.goto(linkIn((await waitForMail(email))[0]!, "verify-email").url);
  await page.getByRole("button", { name: "Confirm my address" }).click();
  await expect(page).toHaveURL(/\/sign-in\?notice=verified/);
  await page.getByLabel("Password", { exact: true }).fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page).toHaveURL(/\/labs\/new$/);

  const m = counter();
  await m.fill(page.getByLabel("Lab name"), `Ready ${stamp} Cath Lab`);
  await m.click(page.getByRole("button", { name: "Create the lab" }));
  await expect(page.getByText("Your role: Manager")).toBeVisible();
  const slug = new URL(page.url()).pathname.split("/")[2]!;
  await sweep(page, seen);

  // All stock from one CSV: preview, then apply.
  await m.click(page.getByRole("link", { name: "Import a CSV file" }));
  m.n.clicks += 1; // choosing the file
  await page.getByLabel("Drop a CSV file here, or choose one").setInputFiles({
    name: "stock.csv",
    mimeType: "text/csv",
    buffer: Buffer.from(CSV),
  });
  const preview = page.getByTestId("import-preview");
  await expect(preview).toContainText("2 families added");
  await expect(preview).toContainText("1 stent platform added");
  await expect(preview.getByTestId("impact")).toHaveText("This change makes no posted copy outdated.");
  await sweep(page, seen);
  await m.click(preview.getByRole("button", { name: "Apply import" }));
  await expect(page.getByRole("status").filter({ hasText: /^✓ Imported stock\.csv/ })).toBeVisible();

  // Invite the medical lead from the overview's step: the form opens with the role chosen.
  await m.click(page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Overview" }));
  await expect(page.getByTestId("first-run-stock")).toHaveAttribute("data-done", "true");
  await sweep(page, seen);
  await m.click(page.getByTestId("first-run-lead").getByRole("link", { name: "Invite a medical lead" }));
  const form = page.getByRole("form", { name: "Invite a person" });
  await expect(form.getByLabel("Role")).toHaveValue("lead");
  await m.fill(form.getByLabel("E-mail address"), leadEmail);
  await m.click(form.getByRole("button", { name: "Send invitation" }));
  await expect(page.getByTestId(`invitation-${leadEmail}`)).toContainText("Medical lead");
  await sweep(page, seen);

  // The lead joins (counted separately): signed in as soon as the account exists.
  const l = counter();
  const leadCtx = await browser.newContext();
  const lead = await leadCtx.newPage();
  await lead.goto(linkIn((await waitForMail(leadEmail))[0]!, "invite").url);
  await l.fill(lead.getByLabel("Your name"), "Dr Omar Reyes (e2e)");
  await l.fill(lead.getByLabel("New password"), PASSWORD);
  await l.fill(lead.getByLabel("Repeat the password"), PASSWORD);
  await l.click(lead.getByRole("button", { name: "Create account and join" }));
  await expect(lead).toHaveURL(new RegExp(`/labs/${slug}$`));

  // A first chart from the POT template, legible on A1 at 1.5 m; an edition for the lead.
  await m.click(page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Overview" }));
  await m.click(page.getByRole("link", { name: "POT chart", exact: true }));
  await m.select(page.getByLabel("Paper"), { label: "A1" });
  await m.fill(page.getByLabel("Reading distance (m)"), "1.5");
  await m.click(page.getByRole("button", { name: "Create chart" }));
  await expect(page.getByRole("heading", { level: 1, name: "POT balloon chart" })).toBeVisible();
  await sweep(page, seen);
  await m.click(page.getByRole("button", { name: "Create edition" }));
  await expect(page.getByRole("status").filter({ hasText: "Edition 1 created" })).toBeVisible();
  const chartUrl = page.url();

  l.n.clicks += 1; // the link in the sign-off e-mail
  await lead.goto(chartUrl);
  await l.click(lead.getByTestId("edition-1").getByLabel(/I have reviewed edition 1/));
  await l.click(lead.getByTestId("edition-1").getByRole("button", { name: "Approve edition 1" }));
  await expect(lead.getByRole("status").filter({ hasText: "Edition 1 approved" })).toBeVisible();
  await leadCtx.close();

  // A room, then the copy recorded as hanging there from the edition's check page.
  await m.click(page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Rooms" }));
  await m.fill(page.getByLabel("New room"), "Room 1");
  await m.click(page.getByRole("button", { name: "Add room" }));
  await expect(page.getByRole("heading", { name: "Room 1" })).toBeVisible();
  await sweep(page, seen);
  await page.goto(chartUrl);
  m.n.clicks += 1; // back to the chart
  await m.click(page.getByTestId("edition-1").getByRole("link", { name: "Check page" }));
  await m.click(page.getByRole("button", { name: "Record" }));
  await expect(page.getByRole("status").filter({ hasText: "Recorded: this copy hangs there." })).toBeVisible();
  await sweep(page, seen);

  const [posted] = await query<{ n: number }>(
    "SELECT COUNT(*) AS n FROM postings p JOIN labs l ON l.id = p.lab_id WHERE l.slug = ? AND p.removed_at IS NULL",
    [slug],
  );
  expect(Number(posted!.n)).toBe(1);

  console.log(
    `lab ready after sign-up: manager ${m.n.clicks} clicks, ${m.n.fields} typed fields; lead ${l.n.clicks} clicks, ${l.n.fields} typed fields; ${seen.size} pages swept (the CSV file not counted)`,
  );
  expect(m.n.clicks + l.n.clicks).toBeLessThan(25);
  expect(m.n.fields + l.n.fields).toBeLessThan(20);

  // A stock change that would outdate the copy asks first and names the room; cancelling keeps it.
  await page.goto(`/labs/${slug}/stock`);
  const toggle = page.getByRole("switch", { name: "Illustrative NC balloon (invented) 3.00 mm in stock" });
  await toggle.click();
  const ask = page.getByRole("dialog", { name: "Posted copies will go out of date" });
  await expect(ask.getByTestId("impact")).toContainText(
    "This change makes 1 posted copy of 1 chart outdated, in Room 1.",
  );
  await ask.getByRole("button", { name: "Cancel" }).click();
  await expect(toggle).toHaveAttribute("aria-checked", "true");
  await toggle.click();
  await ask.getByRole("button", { name: "Mark out of stock" }).click();
  await expect(toggle).toHaveAttribute("aria-checked", "false");
  // The chart page says so at the top.
  await page.goto(chartUrl);
  await expect(page.getByTestId("approval-outdated")).toContainText("approved edition 1 no longer matches");
  await ctx.close();
});
