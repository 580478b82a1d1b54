// Signing in as a seeded demo person, in the browser (the sign-in form) or for API calls (Auth.js over HTTP).
import { expect, request, type APIRequestContext, type Page } from "@playwright/test";
import type { Actor } from "../../authz/matrix";

export const DEMO_PASSWORD = "forkwall-demo-2026";
export const DEMO_EMAIL = {
  manager: "manager@forkwall.test",
  lead: "lead@forkwall.test",
  educator: "educator@forkwall.test",
  operator: "operator@forkwall.test",
} as const;

export async function signInPage(page: Page, email: string): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/dashboard/);
}

/** An API client carrying the actor's session cookie (none for anonymous). */
export async function apiAs(baseURL: string, actor: Actor): Promise<APIRequestContext> {
  const ctx = await request.newContext({ baseURL });
  if (actor === "anonymous") return ctx;
  const { csrfToken } = (await (await ctx.get("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await ctx.post("/api/auth/callback/credentials", { form: { csrfToken, email: DEMO_EMAIL[actor], password: DEMO_PASSWORD }, maxRedirects: 0 });
  expect(res.status(), `sign-in as ${actor}`).toBe(302);
  const session = (await (await ctx.get("/api/auth/session")).json()) as { user?: { email?: string } };
  expect(session.user?.email).toBe(DEMO_EMAIL[actor]);
  return ctx;
}
