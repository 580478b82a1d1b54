import { expect, test, type Page } from "@playwright/test";
import { demoEmail, signInApi, signInPage } from "./support/auth";
import { closeDb, createPerson, uniqueEmail } from "./support/db";
import { linkIn, mailTo, waitForMail } from "../support/mail";

test.afterAll(closeDb);

async function inviteThroughPage(page: Page, email: string, role: string) {
  await page.goto("/labs/demo/members");
  const form = page.getByRole("form", { name: "Invite a person" });
  await form.getByLabel("E-mail address").fill(email);
  await form.getByLabel("Role").selectOption({ label: role });
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(
    page.getByRole("status").filter({ hasText: `Invitation for ${email} as ${role.toLowerCase()} saved` }),
  ).toBeVisible();
  await expect(page.getByTestId(`invitation-${email}`)).toContainText(role);
}

test("a manager invites an operator by e-mail; the invitee joins and sees only what an operator may", async ({
  page,
  browser,
}) => {
  const invitee = uniqueEmail("new-operator");
  await signInPage(page, demoEmail("manager"));
  await inviteThroughPage(page, invitee, "Operator");

  const [mail] = await waitForMail(invitee);
  expect(mail!.subject).toContain("Demo Heart Centre Cath Lab");
  const link = linkIn(mail!, "invite").url;
  expect(new URL(link).pathname).toMatch(/^\/invite\/[A-Za-z0-9_-]{43}$/);

  const ctx = await browser.newContext();
  const guest = await ctx.newPage();
  await guest.goto(link);
  await expect(guest.getByRole("heading", { name: "Join Demo Heart Centre Cath Lab (illustrative)" })).toBeVisible();
  await expect(guest.getByText(invitee)).toBeVisible();

  // Mismatched passwords are refused with a message on the field; the name is kept.
  await guest.getByLabel("Your name").fill("Dr Ada Quinn (e2e)");
  await guest.getByLabel("New password").fill("a long enough phrase");
  await guest.getByLabel("Repeat the password").fill("a different phrase");
  await guest.getByRole("button", { name: "Create account and join" }).click();
  await expect(guest.getByText("The two passwords differ.")).toBeVisible();
  await expect(guest.getByLabel("Your name")).toHaveValue("Dr Ada Quinn (e2e)");

  await guest.getByLabel("New password").fill("a long enough phrase");
  await guest.getByLabel("Repeat the password").fill("a long enough phrase");
  await guest.getByRole("button", { name: "Create account and join" }).click();
  // Signed in at once: the password just chosen is not asked for again.
  await expect(guest).toHaveURL(/\/labs\/demo$/);

  await expect(guest.getByText("Your role: Operator")).toBeVisible();
  const tabs = guest.getByRole("navigation", { name: "Lab" });
  await expect(tabs.getByRole("link", { name: "Overview" })).toBeVisible();
  await expect(tabs.getByRole("link", { name: "Members" })).toHaveCount(0);
  await expect(tabs.getByRole("link", { name: "Audit log" })).toHaveCount(0);
  expect((await guest.request.get("/api/v1/labs/demo/members")).status()).toBe(403);
  expect((await guest.request.get("/api/v1/labs/demo/audit")).status()).toBe(403);
  expect((await guest.request.get("/api/v1/labs/demo-north/members")).status()).toBe(404);
  await guest.goto("/labs/demo/members");
  await expect(guest.getByRole("heading", { name: "Not available for your role" })).toBeVisible();

  // The link worked once.
  await ctx.clearCookies();
  await guest.goto(link);
  await expect(guest.getByText("already been used")).toBeVisible();
  await ctx.close();

  // The manager sees the new member and the acceptance in the audit log.
  await page.goto("/labs/demo/members");
  await expect(page.getByTestId(`member-${invitee}`)).toContainText("Operator");
  await expect(page.getByTestId(`invitation-${invitee}`)).toHaveCount(0);
  await page.goto("/labs/demo/audit");
  const accepted = page.locator('tr[data-action="invitation.accepted"]').first();
  await expect(accepted).toContainText("Dr Ada Quinn (e2e)");
  await expect(accepted).toContainText(invitee);
  await expect(page.locator('tr[data-action="invitation.sent"]').first()).toContainText("Morgan Avery");
});

test("an address that already has an account signs in and accepts, joining with the invited role", async ({
  browser,
  playwright,
  baseURL,
}) => {
  const person = await createPerson({ prefix: "existing", password: "existing-pass-2026" });
  const manager = await playwright.request.newContext({ baseURL });
  await signInApi(manager, demoEmail("manager"));
  const res = await manager.post("/api/v1/labs/demo-north/invitations", {
    data: { email: person.email.toUpperCase(), role: "educator" },
  });
  expect(res.status()).toBe(201);
  expect(await res.json()).toMatchObject({ invitation: { email: person.email, role: "educator" }, emailSent: true });
  await manager.dispose();

  const link = linkIn((await waitForMail(person.email))[0]!, "invite").url;
  const ctx = await browser.newContext();
  const guest = await ctx.newPage();
  await guest.goto(link);
  await guest.getByRole("link", { name: "Sign in to accept" }).click();
  await expect(guest.getByLabel("E-mail")).toHaveValue(person.email);
  await guest.getByLabel("Password", { exact: true }).fill("existing-pass-2026");
  await guest.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(guest).toHaveURL((url) => url.pathname === new URL(link).pathname);
  await guest.getByRole("button", { name: "Join Demo North Cath Lab (illustrative)" }).click();
  await expect(guest).toHaveURL(/\/labs\/demo-north/);
  await expect(guest.getByText("Your role: Educator")).toBeVisible();
  await ctx.close();
});

test("resend sends a fresh link and kills the old one; revoke kills the link", async ({ page, browser }) => {
  const invitee = uniqueEmail("resent");
  await signInPage(page, demoEmail("manager"));
  await inviteThroughPage(page, invitee, "Medical lead");
  const first = linkIn((await waitForMail(invitee, 1))[0]!, "invite").url;

  const row = page.getByTestId(`invitation-${invitee}`);
  await row.getByRole("button", { name: /^Resend/ }).click();
  await expect(page.getByRole("status").filter({ hasText: `A new link was sent to ${invitee}` })).toBeVisible();
  const second = linkIn((await waitForMail(invitee, 2))[1]!, "invite").url;
  expect(second).not.toBe(first);

  const ctx = await browser.newContext();
  const guest = await ctx.newPage();
  await guest.goto(first);
  await expect(guest.getByText("not valid")).toBeVisible();
  await guest.goto(second);
  await expect(guest.getByRole("button", { name: "Create account and join" })).toBeVisible();

  await row.getByRole("button", { name: /^Revoke/ }).click();
  await row.getByRole("button", { name: "Confirm revoke" }).click();
  await expect(page.getByRole("status").filter({ hasText: `The invitation to ${invitee} was revoked` })).toBeVisible();
  await expect(page.getByTestId(`invitation-${invitee}`)).toHaveCount(0);
  await guest.goto(second);
  await expect(guest.getByText("withdrawn")).toBeVisible();
  await ctx.close();
  expect(await mailTo(invitee)).toHaveLength(2);
});

test("bad input on the invite form is refused with the field named, and nothing is sent", async ({ page }) => {
  await signInPage(page, demoEmail("manager"));
  await page.goto("/labs/demo/members");
  const form = page.getByRole("form", { name: "Invite a person" });
  await form.getByLabel("E-mail address").fill("not an address");
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByText("Enter a valid e-mail address")).toBeVisible();
  await expect(form.getByLabel("E-mail address")).toHaveAttribute("aria-invalid", "true");
  await expect(form.getByLabel("E-mail address")).toHaveValue("not an address");
  await form.getByLabel("E-mail address").fill(demoEmail("lead"));
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.locator("#field-email-error")).toHaveText(/Already a member of this lab\./);
  // No invitation went out (the lead may have sign-off mail from other tests' drafts).
  expect((await mailTo(demoEmail("lead"))).filter((m) => m.subject.startsWith("Invitation"))).toEqual([]);
});

test("a manager changes a member's role and removes them; the last manager is protected", async ({
  page,
  playwright,
  baseURL,
}) => {
  const person = await createPerson({ prefix: "member", password: "member-pass-2026", lab: "demo", role: "operator" });
  await signInPage(page, demoEmail("manager"));
  await page.goto("/labs/demo/members");
  const row = page.getByTestId(`member-${person.email}`);
  await row.getByLabel(`Role of ${person.name}`).selectOption("educator");
  await row.getByRole("button", { name: /^Save/ }).click();
  await expect(page.getByRole("status").filter({ hasText: `${person.name} is now educator` })).toBeVisible();
  await expect(row.getByLabel(`Role of ${person.name}`)).toHaveValue("educator");

  await row.getByRole("button", { name: /^Remove/ }).click();
  await row.getByRole("button", { name: "Confirm removal" }).click();
  await expect(page.getByRole("status").filter({ hasText: `${person.name} was removed from the lab` })).toBeVisible();
  await expect(page.getByTestId(`member-${person.email}`)).toHaveCount(0);

  const me = page.getByTestId(`member-${demoEmail("manager")}`);
  await expect(me.getByLabel("Role of Morgan Avery (demo manager)")).toBeDisabled();
  await expect(me).toContainText("A lab keeps one manager");

  // The server refuses it too, whatever the page shows.
  const api = await playwright.request.newContext({ baseURL });
  await signInApi(api, demoEmail("manager"));
  const members = (await (await api.get("/api/v1/labs/demo/members")).json()) as {
    members: { id: number; email: string }[];
  };
  const mine = members.members.find((m) => m.email === demoEmail("manager"))!;
  const demote = await api.patch(`/api/v1/labs/demo/members/${mine.id}`, { data: { role: "operator" } });
  expect(demote.status()).toBe(409);
  expect(((await demote.json()) as { error: { message: string } }).error.message).toMatch(/only manager/);
  expect((await api.delete(`/api/v1/labs/demo/members/${mine.id}`)).status()).toBe(409);
  await api.dispose();

  await page.goto("/labs/demo/audit");
  const removed = page.locator('tr[data-action="member.removed"]').first();
  await expect(removed).toContainText(person.email);
  const changed = page.locator('tr[data-action="member.role_changed"]').first();
  await expect(changed).toContainText("Operator");
  await expect(changed).toContainText("Educator");
});
