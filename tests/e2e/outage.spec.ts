// The test database is stopped under the running app: the check page answers 503 and says the
// printout cannot be verified, lab pages answer a readable 503 page, JSON routes answer 503
// "unavailable" within 2 s; once the database is started again everything works without
// restarting the app.
import { expect, test } from "@playwright/test";
import * as local from "../../db/local-server";
import { demoEmail, signInPage } from "./support/auth";
import { closeDb, demoIds } from "./support/db";

test("with the database stopped, pages and JSON answer 503 readably, and recover when it returns", async ({ page }) => {
  test.setTimeout(120_000);
  const ids = await demoIds();
  const token = ids["token:pot"];
  expect(token).toBeTruthy();
  await signInPage(page, demoEmail("manager"));
  await closeDb();

  const server = local.localServer({ port: Number(process.env.DB_PORT ?? 3307) });
  await local.stop(server);
  try {
    const check = await page.goto(`/v/${token}`);
    expect(check?.status()).toBe(503);
    await expect(page.getByRole("heading", { name: "This printout cannot be verified right now" })).toBeVisible();
    await expect(page.getByText(/Treat the printout as unverified/)).toBeVisible();

    for (const path of ["/labs/demo", "/labs/demo/stock", "/dashboard"]) {
      const res = await page.goto(path);
      expect(res?.status(), path).toBe(503);
      await expect(page.getByRole("heading", { name: "Forkwall cannot reach its database right now" })).toBeVisible();
    }

    for (const path of [`/api/v1/check/${token}`, "/api/v1/labs/demo/stock"]) {
      const t0 = Date.now();
      const res = await page.request.get(path);
      expect(Date.now() - t0, `${path} answered within 2 s`).toBeLessThan(2000);
      expect(res.status(), path).toBe(503);
      expect(await res.json()).toMatchObject({ error: { code: "unavailable", message: /cannot reach its database/ } });
    }

    // The calculator needs no database.
    expect((await page.goto("/calculator"))?.status()).toBe(200);
  } finally {
    await local.start(server);
  }

  const back = await page.goto(`/v/${token}`);
  expect(back?.status()).toBe(200);
  await expect(page.getByText(/current/i).first()).toBeVisible();
  expect((await page.goto("/labs/demo"))?.status()).toBe(200);
  await expect(page.getByRole("heading", { name: /cannot reach its database/ })).toHaveCount(0);
  expect((await page.request.get("/api/v1/labs/demo/stock")).status()).toBe(200);
});
