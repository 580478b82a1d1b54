// `npm run test:cluster`: the three-node Galera cluster (db/cluster.ts) with a fresh test
// database, the mail fake, one production build and two `next start` instances, A on node 1 and
// B on node 2, then the Playwright spec tests/cluster/cluster.spec.ts against them. Ends with
// `N passed, N failed` and the wall time; writes .data/reports/cluster.json for tests/run.ts.
// `--reuse-build` skips the build when NEXT_DIST_DIR already holds one (npm test passes it).
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, mkdirSync, openSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { loadLocalEnv } from "../../db/local-env";
import { clusterDown, clusterNodes, clusterUp, provisionCluster } from "../../db/cluster";
import * as local from "../../db/local-server";

const t0 = Date.now();
const testPort = Number(process.env.TEST_PORT ?? 3100);
// Instances on TEST_PORT+3 and +4 (CLUSTER_APP_PORT overrides A; B takes the next port), clear
// of the project's default database port 3307 when TEST_PORT is 3300.
const portA = Number(process.env.CLUSTER_APP_PORT ?? testPort + 3);
const portB = portA + 1;
const nodes = clusterNodes();
Object.assign(process.env, {
  DB_NAME: process.env.CLUSTER_TEST_DB_NAME ?? "forkwall_cluster_test",
  DB_PORT: String(nodes[0]!.port),
  PORT: String(portA),
  // Both instances answer for one public address, as behind a load balancer.
  APP_URL: `http://localhost:${portA}`,
  SMTP_URL: `smtp://127.0.0.1:${testPort + 8}`,
  MAIL_FAKE_URL: `http://127.0.0.1:${testPort + 9}`,
  NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? ".next-cluster",
  LOG_LEVEL: "warn",
  // Stale-copy digests after one quiet second, so the test sees them go out.
  STALE_MAIL_QUIET_SECONDS: process.env.STALE_MAIL_QUIET_SECONDS ?? "1",
});
delete process.env.DATABASE_URL;
loadLocalEnv();

const reports = path.join(".data", "reports");
mkdirSync(reports, { recursive: true });
const say = (msg: string) => console.log(`\n\x1b[36m[forkwall cluster test]\x1b[0m ${msg}`);

function exec(cmd: string, args: string[], extraEnv: Record<string, string> = {}): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: "inherit", env: { ...process.env, ...extraEnv } });
    child.on("exit", (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

async function waitHealthy(url: string, child: ChildProcess) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`${url}: next start exited ${child.exitCode}`);
    const res = await fetch(`${url}/api/health`).catch(() => null);
    if (res?.status === 200) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not become healthy`);
}

function instance(name: string, port: number, dbPort: number): ChildProcess {
  const log = openSync(path.join(reports, `cluster-${name}.log`), "w");
  return spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, PORT: String(port), DB_PORT: String(dbPort) },
    stdio: ["ignore", log, log],
  });
}

const wasRunning = (await Promise.all(nodes.map((n) => local.isRunning(n)))).some(Boolean);
const instances: ChildProcess[] = [];
let mail: { close(): Promise<void> } | null = null;
let counts = { passed: 0, failed: 1, skipped: 0 };
try {
  say("cluster up");
  await clusterUp({ log: (m) => console.log(m) });
  await provisionCluster({ fresh: true, log: (m) => console.log(m) });
  const { startFakeMail, fakeMailPorts } = await import("@/lib/mail/fake-server");
  mail = await startFakeMail(
    fakeMailPorts(process.env.SMTP_URL!, process.env.MAIL_FAKE_URL!, process.env.MAIL_FAKE_SECRET!),
  );

  const dist = process.env.NEXT_DIST_DIR!;
  if (!(process.argv.includes("--reuse-build") && existsSync(path.join(dist, "BUILD_ID")))) {
    say(`production build into ${dist}`);
    const code = await exec(process.execPath, ["node_modules/next/dist/bin/next", "build"]);
    if (code !== 0) throw new Error("next build failed");
  }
  const A = `http://localhost:${portA}`;
  const B = `http://localhost:${portB}`;
  const a = instance("a", portA, nodes[0]!.port);
  const b = instance("b", portB, nodes[1]!.port);
  instances.push(a, b);
  await Promise.all([waitHealthy(A, a), waitHealthy(B, b)]);
  say(`instance A ${A} on node1 (${nodes[0]!.port}), instance B ${B} on node2 (${nodes[1]!.port})`);

  const json = path.join(reports, "cluster-playwright.json");
  const code = await exec(
    path.join("node_modules", ".bin", "playwright"),
    ["test", "-c", "playwright.cluster.config.ts", ...process.argv.slice(2).filter((x) => x !== "--reuse-build")],
    { CLUSTER_A_URL: A, CLUSTER_B_URL: B, PLAYWRIGHT_JSON_OUTPUT_NAME: json },
  );
  const report = JSON.parse(readFileSync(json, "utf8")) as {
    stats: { expected: number; unexpected: number; flaky: number; skipped: number };
  };
  const failed = report.stats.unexpected + (code !== 0 && report.stats.unexpected === 0 ? 1 : 0);
  counts = { passed: report.stats.expected + report.stats.flaky, failed, skipped: report.stats.skipped };
} catch (err) {
  console.error(err);
} finally {
  for (const child of instances) if (child.exitCode === null) child.kill("SIGTERM");
  await mail?.close();
  if (!wasRunning) await clusterDown({ log: (m) => console.log(m) });
}

const seconds = Math.round((Date.now() - t0) / 100) / 10;
writeFileSync(path.join(reports, "cluster.json"), JSON.stringify({ ...counts, seconds }));
console.log(`\ncluster test took ${seconds} s`);
console.log(`${counts.passed} passed, ${counts.failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ""}`);
process.exit(counts.failed > 0 ? 1 : 0);
