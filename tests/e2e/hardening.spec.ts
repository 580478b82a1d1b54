// The hardening probe's findings, over HTTP against the built server (server.mjs).
import { readFileSync } from "node:fs";
import path from "node:path";
import { expect, test } from "@playwright/test";
import { craftPng } from "../support/image-bombs";
import { DEMO_PASSWORD, demoEmail, signInApi } from "./support/auth";
import { closeDb, createPerson, demoIds } from "./support/db";

test.afterAll(closeDb);

test("a cookie copied before sign-out no longer reads lab data (finding 4)", async ({ playwright, baseURL }) => {
  const person = await createPerson({ prefix: "copied", password: "copied-pass-2026", lab: "demo", role: "operator" });
  const a = await playwright.request.newContext({ baseURL });
  await signInApi(a, person.email, "copied-pass-2026");
  expect((await a.get("/api/v1/labs/demo/rooms")).status()).toBe(200);
  const stolen = await a.storageState();
  const { csrfToken } = (await (await a.get("/api/auth/csrf")).json()) as { csrfToken: string };
  await a.post("/api/auth/signout", { form: { csrfToken }, maxRedirects: 0 });
  const b = await playwright.request.newContext({ baseURL, storageState: stolen });
  expect((await b.get("/api/v1/labs/demo/rooms")).status()).toBe(401);
  await a.dispose();
  await b.dispose();
});

test("TRACE and unknown methods answer 405, never 500 (finding 13)", async ({ request }) => {
  for (const url of ["/api/health", "/api/v1/solve", "/api/v1/labs/demo/rooms", "/sign-in"]) {
    for (const method of ["TRACE", "PROPFIND"]) {
      const res = await request.fetch(url, { method });
      expect(res.status(), `${method} ${url}`).toBe(405);
    }
  }
});

test("a server action with a body the framework cannot read answers 400, never 500 (finding 13)", async ({
  request,
}) => {
  // A real action id from the build under test; the bodies are what a broken or hostile client sends.
  const manifest = JSON.parse(
    readFileSync(
      path.join(process.env.NEXT_DIST_DIR ?? ".next-test", "server", "server-reference-manifest.json"),
      "utf8",
    ),
  ) as { node: Record<string, unknown> };
  const actionId = Object.keys(manifest.node)[0]!;
  for (const contentType of ["text/plain;charset=UTF-8", "multipart/form-data; boundary=xyz"]) {
    const res = await request.post("/sign-in", {
      headers: { "next-action": actionId, "content-type": contentType },
      data: "garbage{",
    });
    expect(res.status(), contentType).toBe(400);
    expect((await res.json()).error.code).toBe("invalid_input");
  }
});

test("a javascript: or foreign callbackUrl gets 400 from next-auth's endpoints (finding 13)", async ({ request }) => {
  for (const cb of ["javascript:alert(1)", "https://evil.example/", "//evil.example/"]) {
    const get = await request.get(`/api/auth/signin?callbackUrl=${encodeURIComponent(cb)}`, { maxRedirects: 0 });
    expect(get.status(), cb).toBe(400);
    const { csrfToken } = (await (await request.get("/api/auth/csrf")).json()) as { csrfToken: string };
    const post = await request.post("/api/auth/callback/credentials", {
      form: { csrfToken, email: demoEmail("operator"), password: DEMO_PASSWORD, callbackUrl: cb },
      maxRedirects: 0,
    });
    expect(post.status(), cb).toBe(400);
    expect(post.headers()["set-cookie"] ?? "").not.toContain("session-token");
  }
});

test("authenticated JSON is private, no-store; lab slugs match exactly (finding 14)", async ({ request }) => {
  await signInApi(request, demoEmail("manager"));
  const res = await request.get("/api/v1/labs/demo/rooms");
  expect(res.status()).toBe(200);
  expect(res.headers()["cache-control"]).toBe("private, no-store");
  for (const slug of ["DEMO", "demo%00", "Demo", "demo%20"])
    expect((await request.get(`/api/v1/labs/${slug}/rooms`)).status(), slug).toBe(404);
});

test("the sign-in banner never repeats query text (finding 12)", async ({ page }) => {
  await page.goto("/sign-in?joined=" + encodeURIComponent("Evil Lab. Call +1 555 0100 now"));
  await expect(page.getByText("555 0100")).toHaveCount(0);
  await page.goto("/sign-in?notice=joined");
  await expect(page.getByText("Your account is ready and you have joined the lab.")).toBeVisible();
});

test("free text with a lone surrogate, NUL or bidi override is a 400 naming the field (finding 10)", async ({
  request,
}) => {
  await signInApi(request, demoEmail("manager"));
  for (const raw of ['{"name":"Room \\ud800"}', '{"name":"Room\\u00001"}', '{"name":"\\u202eRoom"}']) {
    const res = await request.post("/api/v1/labs/demo/rooms", {
      headers: { "content-type": "application/json" },
      data: raw,
    });
    expect(res.status(), raw).toBe(400);
    const body = (await res.json()) as { error: { issues: { path: string[] }[] } };
    expect(body.error.issues[0]!.path).toEqual(["name"]);
  }
});

test("an image bomb is refused with 400 and the server keeps answering (finding 2)", async ({ request }) => {
  await signInApi(request, demoEmail("manager"));
  const ids = await demoIds();
  for (const bomb of [
    await craftPng({ width: 8000, height: 8000 }, 64 * 1024),
    await craftPng({ width: 4000, height: 4000, bitDepth: 16 }),
    await craftPng({ width: 1000, height: 1000, interlaced: true }, 96 * 1024 * 1024),
  ]) {
    const [upload, health] = await Promise.all([
      request.put(`/api/v1/charts/${ids["chart:pot"]}/logo`, {
        multipart: { file: { name: "logo.png", mimeType: "image/png", buffer: bomb } },
      }),
      request.get("/api/health"),
    ]);
    expect(upload.status()).toBe(400);
    expect(health.status()).toBe(200);
  }
});
