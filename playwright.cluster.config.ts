import { defineConfig } from "@playwright/test";

// `npm run test:cluster` (tests/cluster/run.ts) starts the Galera cluster and the two app
// instances and exports CLUSTER_A_URL / CLUSTER_B_URL; this config only runs the spec.
export default defineConfig({
  testDir: "tests/cluster",
  testMatch: "*.spec.ts",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 90_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json"]],
  outputDir: ".data/reports/cluster-output",
});
