import { defineConfig } from "@playwright/test";

// Run by tests/run.ts, which provisions the test database and exports its settings.
const port = Number(process.env.PORT ?? 3100);
const baseURL = `http://localhost:${port}`;

export default defineConfig({
  testDir: "tests/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json"]],
  outputDir: ".data/reports/playwright-output",
  use: {
    baseURL,
    headless: true,
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-dev-shm-usage",
        "--disable-gpu",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--no-first-run",
      ],
    },
  },
  webServer: {
    // server.mjs: Next behind a Node server that records the socket's address. The browser
    // tests stand in for a proxy (each signs in "from" its own X-Forwarded-For address), so one
    // hop is trusted here; lib/http/client-address.ts's unit tests cover TRUST_PROXY=0.
    command: `node server.mjs`,
    env: { HOST: "127.0.0.1", PORT: String(port), TRUST_PROXY: process.env.TRUST_PROXY ?? "1" },
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: "ignore",
    stderr: "pipe",
  },
});
