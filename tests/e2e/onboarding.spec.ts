// A new lab gets in, as a new person would on a fresh install: sign up, confirm the address
// through the local mail fake, create the lab, add stock from the size ladder, invite a medical
// lead and an educator, design a first chart from a template, have the lead approve it, and
// download the approved poster.
import { readFileSync } from "node:fs";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { pdfInfo, pdfText } from "../support/pdf-tools";
import { demoEmail, signInPage } from "./support/auth";
import { closeDb, createPerson, query, uniqueEmail } from "./support/db";
import { linkIn, mailTo, waitForMail } from "../support/mail";

test.afterAll(closeDb);

const PASSWORD = "a long enough phrase";

async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
}

/** An invited person opens their link, creates the account and lands in the lab, signed in. */
async function acceptInvitation(browser: Browser, email: string, name: string, slug: string) {
  const link = linkIn((await waitForMail(email))[0]!, "invite").url;
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await page.goto(link);
  await page.getByLabel("Your name").fill(name);
  await page.getByLabel("New password").fill(PASSWORD);
  await page.getByLabel("Repeat the password").fill(PASSWORD);
  await page.getByRole("button", { name: "Create account and join" }).click();
  // Signed in by creating the account: the new password is not asked for again.
  await expect(page).toHaveURL(new RegExp(`/labs/${slug}$`));
  return page;
}

test("a new person signs up, confirms, creates a lab, stocks it, invites a team and downloads a first approved poster", async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const stamp = Date.now().toString(36);
  const email = uniqueEmail("founder");
  const slug = `e2e-heart-${stamp}`;
  const labName = `E2E Heart ${stamp} Cath Lab`;

  // Sign up.
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await page.goto("/sign-in");
  await page.getByRole("link", { name: "create an account" }).click();
  await expect(page).toHaveURL(/\/sign-up$/);
  await page.getByLabel("Your name").fill("Dr Rowan Achebe (e2e)");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("short");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByText("Use at least 10 characters.")).toBeVisible();
  await expect(page.getByLabel("Your name")).toHaveValue("Dr Rowan Achebe (e2e)");
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page).toHaveURL(/\/check-email/);
  await expect(page.getByRole("heading", { name: "Check your e-mail" })).toBeVisible();

  // Until the address is confirmed, signing in shows only "check your e-mail".
  await page.goto("/sign-in");
  await signIn(page, email);
  await expect(page).toHaveURL(/\/check-email$/);
  await expect(page.getByTestId("unverified-email")).toHaveText(email);
  await page.goto("/labs/new");
  await expect(page).toHaveURL(/\/check-email$/);
  const early = await page.request.post("/api/v1/labs", { data: { name: labName, slug } });
  expect(early.status()).toBe(403);
  await page.getByRole("button", { name: "Send a new link" }).click();
  await expect(page.getByRole("status").filter({ hasText: `A new link is on its way to ${email}` })).toBeVisible();

  // Confirm through the newest link in the local mail fake (the first one no longer works).
  const mails = await waitForMail(email, 2);
  expect(mails.every((m) => m.subject === "Confirm your e-mail address for Forkwall")).toBe(true);
  await page.goto(linkIn(mails[0]!, "verify-email").url);
  await expect(page.getByText("already been used (or a newer one was sent)")).toBeVisible();
  await page.goto(linkIn(mails[1]!, "verify-email").url);
  await page.getByRole("button", { name: "Confirm my address" }).click();

  // Create the lab: the slug is suggested from the name and checked by the same rules as the API.
  await expect(page).toHaveURL(/\/labs\/new$/);
  await page.getByLabel("Lab name").fill(labName);
  await expect(page.getByLabel("Address (slug)")).toHaveValue(`e2e-heart-${stamp}-cath-lab`);
  await page.getByLabel("Address (slug)").fill("settings");
  await page.getByRole("button", { name: "Create the lab" }).click();
  await expect(page.getByText("That word is reserved; choose another.")).toBeVisible();
  await page.getByLabel("Address (slug)").fill(slug);
  await page.getByRole("button", { name: "Create the lab" }).click();
  await expect(page).toHaveURL(new RegExp(`/labs/${slug}$`));
  await expect(page.getByText("Your role: Manager")).toBeVisible();
  const steps = page.getByRole("region", { name: /Getting your lab started/ });
  await expect(steps.getByRole("heading")).toHaveText("Getting your lab started: 5 of 5 steps left");
  await expect(page.getByTestId("first-run-stock")).toContainText("No balloon sizes in stock yet");

  // Stock from the generic ladder: no pressure is offered; the manager types them.
  await page.getByRole("link", { name: /Start from a generic size ladder/ }).click();
  await expect(page).toHaveURL(new RegExp(`/labs/${slug}/stock/ladder$`));
  await page.getByLabel("Family name").fill("NC ladder (e2e, illustrative)");
  await expect(page.getByLabel("Nominal pressure (atm)")).toHaveValue("");
  await expect(page.getByLabel("Rated burst pressure (atm)")).toHaveValue("");
  await page.getByRole("button", { name: "Add this family to the stock" }).click();
  await expect(page.getByText("Nominal pressure is required.")).toBeVisible();
  await expect(page.getByText("Rated burst pressure is required.")).toBeVisible();
  await page.getByLabel("Nominal pressure (atm)").fill("12");
  await page.getByLabel("Rated burst pressure (atm)").fill("20");
  await page.getByLabel("1.50").uncheck();
  await page.getByRole("button", { name: "Add this family to the stock" }).click();
  await expect(page).toHaveURL(new RegExp(`/labs/${slug}$`));
  await expect(page.getByTestId("first-run-stock")).toHaveAttribute("data-done", "true");
  await expect(page.getByTestId("first-run-stock")).toContainText("14 balloon sizes in stock in 1 family.");
  const [family] = await query<{ nominal: string; rbp: string }>(
    "SELECT f.nominal_atm AS nominal, f.rbp_atm AS rbp FROM balloon_families f JOIN labs l ON l.id = f.lab_id WHERE l.slug = ?",
    [slug],
  );
  expect([Number(family!.nominal), Number(family!.rbp)]).toEqual([12, 20]);

  // Invite a medical lead and an educator from the step's link.
  const leadEmail = uniqueEmail("lead");
  const educatorEmail = uniqueEmail("educator");
  for (const [address, role] of [
    [leadEmail, "Medical lead"],
    [educatorEmail, "Educator"],
  ] as const) {
    await page.goto(`/labs/${slug}`);
    await page
      .getByTestId(role === "Educator" ? "first-run-educator" : "first-run-lead")
      .getByRole("link")
      .click();
    const form = page.getByRole("form", { name: "Invite a person" });
    await form.getByLabel("E-mail address").fill(address);
    await form.getByLabel("Role").selectOption({ label: role });
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect(page.getByTestId(`invitation-${address}`)).toContainText(role);
  }
  await page.goto(`/labs/${slug}`);
  await expect(page.getByTestId("first-run-lead")).toContainText("Invited, waiting for them to accept");
  const lead = await acceptInvitation(browser, leadEmail, "Dr Noor Haddad (e2e)", slug);
  const educator = await acceptInvitation(browser, educatorEmail, "Kit Marlow (e2e)", slug);
  await educator.context().close();
  await page.reload();
  await expect(page.getByTestId("first-run-lead")).toHaveAttribute("data-done", "true");
  await expect(page.getByTestId("first-run-educator")).toHaveAttribute("data-done", "true");

  // A POT chart is checked against a stent platform (a lab rule): the manager records one first.
  const platform = await page.request.post(`/api/v1/labs/${slug}/stock/platforms`, {
    data: { name: "DES platform (e2e, illustrative)" },
  });
  expect(platform.status()).toBe(201);
  const platformId = ((await platform.json()) as { platform: { id: number } }).platform.id;
  for (const [nominalMm, maxPostDilatationMm] of [
    [2.5, 3.5],
    [3, 4.5],
    [3.5, 5],
  ])
    expect(
      (
        await page.request.post(`/api/v1/labs/${slug}/stock/platforms/${platformId}/sizes`, {
          data: { nominalMm, maxPostDilatationMm },
        })
      ).status(),
    ).toBe(201);

  // A first chart from the POT template; its axes start at the stocked range.
  await page.getByRole("link", { name: "POT chart", exact: true }).click();
  await expect(page).toHaveURL(new RegExp(`/labs/${slug}/charts/new\\?template=pot$`));
  await expect(page.getByLabel("Title")).toHaveValue("POT balloon chart");
  await page.getByLabel("Paper").selectOption("A1");
  await page.getByLabel("Reading distance (m)").fill("1.5");
  await expect(page.getByTestId("legibility")).toContainText("Legible");
  await page.getByRole("button", { name: "Create chart" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "POT balloon chart" })).toBeVisible();
  await page.getByRole("button", { name: "Create edition" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Edition 1 created" })).toBeVisible();
  await expect(page.getByTestId("edition-1").getByRole("button", { name: /Approve/ })).toHaveCount(0);
  const chartUrl = page.url();

  // The medical lead reviews and approves it.
  await lead.goto(chartUrl);
  await lead
    .getByTestId("edition-1")
    .getByLabel(/I have reviewed edition 1/)
    .check();
  await lead.getByTestId("edition-1").getByRole("button", { name: "Approve edition 1" }).click();
  await expect(lead.getByRole("status").filter({ hasText: "Edition 1 approved" })).toBeVisible();
  await lead.context().close();

  // The manager downloads the approved poster; it reads back right.
  await page.reload();
  await expect(page.getByTestId("edition-1")).toContainText("Approved");
  const [download] = await Promise.all([
    page.waitForEvent("download"),
    page.getByTestId("edition-1").getByRole("link", { name: "Download PDF" }).click(),
  ]);
  const pdf = readFileSync(await download.path());
  expect(pdfInfo(pdf).pages).toBe(1);
  const text = (await pdfText(pdf)).text.replace(/\s+/g, " ");
  expect(text).toContain("POT balloon chart");
  expect(text).toContain("Edition 1");
  expect(text).toContain("Dr Noor Haddad (e2e)");
  expect(text).toContain("Reference aid only");
  // A real lab's poster never claims its numbers are invented demo data.
  expect(text).not.toMatch(/invented/i);

  // Every step is done: the overview no longer walks the manager through them.
  await page.goto(`/labs/${slug}`);
  await expect(page.getByRole("region", { name: /Getting your lab started/ })).toHaveCount(0);
  await ctx.close();
});

test("POST /api/v1/accounts answers 202 alike for a new and an existing address, and 400 naming bad fields", async ({
  request,
}) => {
  const fresh = uniqueEmail("api-signup");
  const send = (email: string) =>
    request.post("/api/v1/accounts", { data: { name: "API Person", email, password: PASSWORD } });
  const [a, b] = [await send(fresh), await send(demoEmail("manager"))];
  expect([a.status(), b.status()]).toEqual([202, 202]);
  const [ja, jb] = [await a.json(), await b.json()];
  expect(Object.keys(ja)).toEqual(Object.keys(jb));
  expect(ja.message.replace(fresh, "X")).toBe(jb.message.replace(demoEmail("manager"), "X"));
  await expect
    .poll(async () => (await mailTo(fresh)).map((m) => m.subject))
    .toEqual(["Confirm your e-mail address for Forkwall"]);
  await expect
    .poll(async () => (await mailTo(demoEmail("manager"))).map((m) => m.subject))
    .toContain("You already have a Forkwall account");

  const bad = await request.post("/api/v1/accounts", { data: { name: "", email: "nope", password: "x" } });
  expect(bad.status()).toBe(400);
  const body = await bad.json();
  expect(body.error.issues.map((i: { path: string[] }) => i.path[0]).sort()).toEqual(["email", "name", "password"]);
});

test("the account page: name, password (current one required), e-mail through a link, and leaving labs", async ({
  page,
}) => {
  const person = await createPerson({ prefix: "account", password: PASSWORD, lab: "demo-north", role: "educator" });
  await signInPage(page, person.email, PASSWORD);
  await page.getByTestId("signed-in-as").click();
  await expect(page).toHaveURL(/\/account$/);
  await expect(page.getByTestId("lab-demo-north")).toContainText("Educator");

  const nameForm = page.getByRole("form", { name: "Change your name" });
  await nameForm.getByLabel("Name", { exact: true }).fill("E2E Renamed Person");
  await nameForm.getByRole("button", { name: "Save name" }).click();
  await expect(nameForm.getByRole("status")).toHaveText(/Your name was saved/);
  await expect(page.getByTestId("signed-in-as")).toHaveText("E2E Renamed Person");

  const pw = page.getByRole("form", { name: "Change your password" });
  await pw.getByLabel("Current password").fill("not my password");
  await pw.getByLabel("New password").fill("another long phrase");
  await pw.getByLabel("Repeat the password").fill("another long phrase");
  await pw.getByRole("button", { name: /Change password/ }).click();
  await expect(pw.getByText("That is not your current password.")).toBeVisible();

  // A lab of one's own cannot be left by its only manager.
  const slug = `e2e-own-${Date.now().toString(36)}`;
  const created = await page.request.post("/api/v1/labs", { data: { name: "Own lab (e2e)", slug } });
  expect(created.status()).toBe(201);
  expect((await page.request.post("/api/v1/labs", { data: { name: "Again", slug } })).status()).toBe(409);
  await page.reload();
  const own = page.getByTestId(`lab-${slug}`);
  await own.getByRole("button", { name: "Leave Own lab (e2e)" }).click();
  await expect(own.getByRole("alert")).toContainText("You are the only manager of Own lab (e2e)");
  await page
    .getByTestId("lab-demo-north")
    .getByRole("button", { name: /^Leave/ })
    .click();
  await expect(page.getByTestId("lab-demo-north")).toHaveCount(0);

  // A new address takes effect only through the link sent to it.
  const next = uniqueEmail("account-moved");
  const emailForm = page.getByRole("form", { name: "Change your e-mail address" });
  await emailForm.getByLabel("New e-mail address").fill(next);
  await emailForm.getByLabel("Current password").fill(PASSWORD);
  await emailForm.getByRole("button", { name: "Send the link" }).click();
  await expect(emailForm.getByRole("status")).toContainText(`A link is on its way to ${next}`);
  await expect(page.getByTestId("pending-email")).toContainText(next);
  await page.goto(linkIn((await waitForMail(next))[0]!, "verify-email").url);
  await page.getByRole("button", { name: "Use this address from now on" }).click();
  await expect(page).toHaveURL(/\/account$/);
  await expect(emailForm.getByText(next)).toBeVisible();
  await expect
    .poll(async () => (await mailTo(person.email)).map((m) => m.subject))
    .toContain("Your Forkwall e-mail address was changed");
});
