import { expect, test } from "@playwright/test";

const LOCAL_HOSTS = new Set(["localhost", "127.0.0.1", "[::1]"]);

test("the landing page says what Forkwall does, in the shipped font, with no request leaving this machine", async ({
  page,
}) => {
  const outbound: string[] = [];
  page.on("request", (req) => {
    const url = new URL(req.url());
    if (
      (url.protocol === "http:" || url.protocol === "https:" || url.protocol === "ws:") &&
      !LOCAL_HOSTS.has(url.hostname)
    ) {
      outbound.push(req.url());
    }
  });
  const fontResponses: string[] = [];
  page.on("response", (res) => {
    if (/\.(ttf|woff2?)(\?|$)/.test(res.url()) && res.ok()) fontResponses.push(res.url());
  });

  await page.goto("/");
  const heading = page.getByRole("heading", { level: 1 });
  await expect(heading).toContainText("Forkwall turns your cath lab");

  // The heading is set in a font face the page loaded from this origin (Inter from fonts/).
  const font = await heading.evaluate(async (el) => {
    await document.fonts.ready;
    const family = getComputedStyle(el).fontFamily;
    const loaded = [...document.fonts].filter((f) => f.status === "loaded").map((f) => f.family.replace(/["']/g, ""));
    const first = family.split(",")[0]!.trim().replace(/["']/g, "");
    return { family, first, loaded, rendered: document.fonts.check(`700 16px "${first}"`) };
  });
  expect(font.loaded).toContain(font.first);
  expect(font.rendered).toBe(true);
  expect(fontResponses.length).toBeGreaterThan(0);
  for (const url of fontResponses) expect(new URL(url).hostname).toBe("localhost");

  await page.goto("/sign-in");
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  expect(outbound, `requests left 127.0.0.1: ${outbound.join(", ")}`).toEqual([]);
});

test("health answers ok with a live database", async ({ request }) => {
  const res = await request.get("/api/health");
  expect(res.status()).toBe(200);
  expect(await res.json()).toEqual({ status: "ok", db: "ok" });
  expect(res.headers()["x-content-type-options"]).toBe("nosniff");
  expect(res.headers()["content-security-policy"]).toContain("frame-ancestors 'none'");
});
