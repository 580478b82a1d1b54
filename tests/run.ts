// `npm test`: the same provisioning as `npm start` on a fresh test database, then lint,
// typecheck, prettier --check, vitest (unit, tools, integration on the real MariaDB), a
// production build, the Playwright suite in Debian's chromium and the Galera cluster test
// (tests/cluster/run.ts; `--no-cluster` skips it). Ends with one line `N passed, N failed`.
import { spawn } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { loadLocalEnv } from "../db/local-env";

// Test settings win over .env.local: their own database, ports and build folder.
// TEST_PORT (default 3100) is the web port; the mail fake takes the next two.
const testPort = Number(process.env.TEST_PORT ?? 3100);
Object.assign(process.env, {
  DB_NAME: process.env.TEST_DB_NAME ?? "forkwall_test",
  PORT: String(testPort),
  APP_URL: `http://localhost:${testPort}`,
  SMTP_URL: `smtp://127.0.0.1:${testPort + 1}`,
  MAIL_FAKE_URL: `http://127.0.0.1:${testPort + 2}`,
  NEXT_DIST_DIR: ".next-test",
  // Request lines would drown the test output; warnings and errors still show.
  LOG_LEVEL: process.env.LOG_LEVEL ?? "warn",
  // Stale-copy digests go out one quiet second after a lab's last change (the default is ten
  // minutes), so the mail tests see them.
  STALE_MAIL_QUIET_SECONDS: process.env.STALE_MAIL_QUIET_SECONDS ?? "1",
});
loadLocalEnv();

const { env } = await import("@/lib/env");
const { provision } = await import("../db/provision");
const local = await import("../db/local-server");
const { startFakeMail, fakeMailPorts } = await import("@/lib/mail/fake-server");

const say = (msg: string) => console.log(`\n\x1b[36m[forkwall test]\x1b[0m ${msg}`);
const reports = path.join(".data", "reports");
rmSync(reports, { recursive: true, force: true });
mkdirSync(reports, { recursive: true });

type Tally = { name: string; passed: number; failed: number; skipped: number; note?: string };
const tallies: Tally[] = [];

function exec(cmd: string, args: string[], extraEnv: Record<string, string> = {}): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: "inherit", env: { ...process.env, ...extraEnv } });
    child.on("exit", (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

const bin = (name: string) => path.join("node_modules", ".bin", name);

async function check(name: string, cmd: string, args: string[], extraEnv?: Record<string, string>) {
  say(name);
  const code = await exec(cmd, args, extraEnv);
  tallies.push({ name, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1, skipped: 0 });
  return code === 0;
}

function readJson<T>(file: string): T | null {
  try {
    return JSON.parse(readFileSync(file, "utf8")) as T;
  } catch {
    return null;
  }
}

let startedDb = false;
let mail: Awaited<ReturnType<typeof startFakeMail>> | null = null;
const onlyVitest = process.argv.includes("--unit-only");

try {
  say(`provisioning ${env.DB_NAME} (fresh)`);
  const { startedHere } = await provision(env, { fresh: true, log: (m) => console.log(m) });
  startedDb = startedHere;
  mail = await startFakeMail(fakeMailPorts(env.SMTP_URL, env.MAIL_FAKE_URL!, env.MAIL_FAKE_SECRET!));

  await check("lint (eslint)", bin("eslint"), [".", "--max-warnings=0"]);
  await check("typecheck (tsc --noEmit)", bin("tsc"), ["--noEmit"]);

  await check("format (npm run format:check)", "npm", ["run", "--silent", "format:check"]);

  // One run per vitest project, each tallied on its own line.
  const projects = [
    ["unit", "vitest: unit (pure code)"],
    ["tools", "vitest: tools (poppler, zbar, node)"],
    ["integration", "vitest: integration (real MariaDB)"],
  ] as const;
  for (const [project, name] of projects) {
    say(name);
    const vitestJson = path.join(reports, `vitest-${project}.json`);
    const vcode = await exec(bin("vitest"), [
      "run",
      `--project=${project}`,
      "--reporter=default",
      "--reporter=json",
      `--outputFile.json=${vitestJson}`,
    ]);
    const v = readJson<{
      numPassedTests: number;
      numFailedTests: number;
      numPendingTests: number;
      numTodoTests: number;
    }>(vitestJson);
    if (v) {
      const failed = v.numFailedTests + (vcode !== 0 && v.numFailedTests === 0 ? 1 : 0);
      tallies.push({ name, passed: v.numPassedTests, failed, skipped: v.numPendingTests + v.numTodoTests });
    } else tallies.push({ name, passed: 0, failed: 1, skipped: 0, note: "no report" });
  }

  if (!onlyVitest) {
    const built = await check("production build (next build)", process.execPath, [
      "node_modules/next/dist/bin/next",
      "build",
    ]);
    if (built) {
      say("playwright (Debian chromium)");
      const pwJson = path.join(reports, "playwright.json");
      const pcode = await exec(bin("playwright"), ["test"], { PLAYWRIGHT_JSON_OUTPUT_NAME: pwJson });
      const p = readJson<{ stats: { expected: number; unexpected: number; flaky: number; skipped: number } }>(pwJson);
      if (p) {
        const failed = p.stats.unexpected + (pcode !== 0 && p.stats.unexpected === 0 ? 1 : 0);
        tallies.push({
          name: "playwright",
          passed: p.stats.expected + p.stats.flaky,
          failed,
          skipped: p.stats.skipped,
        });
      } else tallies.push({ name: "playwright", passed: 0, failed: 1, skipped: 0, note: "no report" });
    } else tallies.push({ name: "playwright", passed: 0, failed: 1, skipped: 0, note: "not run: build failed" });

    // The Galera cluster test (tests/cluster/run.ts) reuses this build; about a minute here.
    if (built && !process.argv.includes("--no-cluster")) {
      say("cluster: two instances on a three-node Galera cluster");
      const clusterJson = path.join(reports, "cluster.json");
      const ccode = await exec(process.execPath, [
        "--conditions=react-server",
        "--import",
        "tsx",
        "tests/cluster/run.ts",
        "--reuse-build",
      ]);
      const c = readJson<{ passed: number; failed: number; skipped: number; seconds: number }>(clusterJson);
      if (c)
        tallies.push({
          name: "cluster (Galera)",
          passed: c.passed,
          failed: c.failed + (ccode !== 0 && c.failed === 0 ? 1 : 0),
          skipped: c.skipped,
          note: `${c.seconds} s`,
        });
      else tallies.push({ name: "cluster (Galera)", passed: 0, failed: 1, skipped: 0, note: "no report" });
    }
  }
} catch (err) {
  console.error(err);
  tallies.push({ name: "provisioning", passed: 0, failed: 1, skipped: 0 });
} finally {
  await mail?.close();
  if (startedDb && existsSync(".data")) await local.stop(local.localServer({ port: env.DB_PORT }));
}

console.log("\nsuite                              passed  failed  skipped");
for (const t of tallies) {
  console.log(
    `${t.name.padEnd(34)} ${String(t.passed).padStart(6)}  ${String(t.failed).padStart(6)}  ${String(t.skipped).padStart(7)}${t.note ? `  (${t.note})` : ""}`,
  );
}
const passed = tallies.reduce((s, t) => s + t.passed, 0);
const failed = tallies.reduce((s, t) => s + t.failed, 0);
const skipped = tallies.reduce((s, t) => s + t.skipped, 0);
console.log(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed > 0 ? 1 : 0);
