// Signing in as a seeded role, through next-auth's own endpoint (API tests) or the page.
import { expect, request, type APIRequestContext, type Page } from "@playwright/test";
import type { Role } from "../../../lib/permissions";

export const DEMO_PASSWORD = "forkwall-demo-2026";
export const demoEmail = (role: Role) => `${role}@forkwall.test`;

/** POST /api/auth/callback/credentials with the CSRF token; returns where next-auth redirected. */
export async function postCredentials(
  request: APIRequestContext,
  email: string,
  password: string,
  headers: Record<string, string> = {},
): Promise<string> {
  const csrf = await request.get("/api/auth/csrf", { headers });
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await request.post("/api/auth/callback/credentials", {
    form: { email, password, csrfToken, callbackUrl: "/dashboard" },
    maxRedirects: 0,
    headers,
  });
  expect(res.status(), "next-auth answers a credentials sign-in with a redirect").toBe(302);
  return res.headers()["location"] ?? "";
}

export async function signInApi(request: APIRequestContext, email: string, password = DEMO_PASSWORD) {
  const location = await postCredentials(request, email, password);
  expect(location, `sign-in as ${email}`).not.toContain("error=");
  const session = (await (await request.get("/api/auth/session")).json()) as { user?: { email?: string } } | null;
  expect(session?.user?.email).toBe(email);
}

export async function signInPage(page: Page, email: string, password = DEMO_PASSWORD, callbackUrl?: string) {
  await page.goto(callbackUrl ? `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}` : "/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page.getByTestId("signed-in-as")).toBeVisible();
}

/** An API client carrying a demo role's session cookie (none for anonymous). */
export async function apiAs(baseURL: string, actor: Role | "anonymous"): Promise<APIRequestContext> {
  const ctx = await request.newContext({ baseURL });
  if (actor !== "anonymous") await signInApi(ctx, demoEmail(actor));
  return ctx;
}
