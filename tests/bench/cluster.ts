// `npm run bench:cluster`: stock-change latency and check-page throughput on one MariaDB server
// with one app instance, then on the Galera cluster with two instances (A on node 1, B on
// node 2), printed with their ratios. Bounded: a fixed number of changes and a fixed time of
// requests, all to 127.0.0.1. Reuses the production build in NEXT_DIST_DIR (.next-cluster),
// building it when missing. Options: --changes N (20), --seconds S (5), --concurrency C (8).
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, mkdirSync, openSync } from "node:fs";
import path from "node:path";
import { parseArgs } from "node:util";
import mysql from "mysql2/promise";
import { clusterDown, clusterNodes } from "../../db/cluster";
import { loadLocalEnv } from "../../db/local-env";
import * as local from "../../db/local-server";

const { values: opts } = parseArgs({
  options: {
    changes: { type: "string", default: "20" },
    seconds: { type: "string", default: "5" },
    concurrency: { type: "string", default: "8" },
  },
});
const CHANGES = Math.min(Math.max(Number(opts.changes), 2), 200);
const SECONDS = Math.min(Math.max(Number(opts.seconds), 1), 30);
const CONCURRENCY = Math.min(Math.max(Number(opts.concurrency), 1), 32);

const testPort = Number(process.env.TEST_PORT ?? 3100);
// Instances on TEST_PORT+3 and +4 (CLUSTER_APP_PORT overrides A; B takes the next port), clear
// of the project's default database port 3307 when TEST_PORT is 3300.
const portA = Number(process.env.CLUSTER_APP_PORT ?? testPort + 3);
const portB = portA + 1;
const DB_NAME = "forkwall_bench";
Object.assign(process.env, {
  DB_NAME,
  APP_URL: `http://localhost:${portA}`,
  SMTP_URL: `smtp://127.0.0.1:${testPort + 8}`,
  MAIL_FAKE_URL: `http://127.0.0.1:${testPort + 9}`,
  NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? ".next-cluster",
  LOG_LEVEL: "warn",
});
delete process.env.DATABASE_URL;
loadLocalEnv();
const singlePort = Number(process.env.DB_PORT ?? 3307);
const nodes = clusterNodes();
const reports = path.join(".data", "reports");
mkdirSync(reports, { recursive: true });
const say = (msg: string) => console.log(`\x1b[36m[forkwall bench]\x1b[0m ${msg}`);

function exec(args: string[], extraEnv: Record<string, string>): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { stdio: "inherit", env: { ...process.env, ...extraEnv } });
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${args.join(" ")} exited ${code}`))));
  });
}
const tsx = (entry: string, ...args: string[]) => ["--conditions=react-server", "--import", "tsx", entry, ...args];

function instance(name: string, port: number, dbPort: number): ChildProcess {
  const log = openSync(path.join(reports, `bench-${name}.log`), "w");
  return spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, PORT: String(port), DB_PORT: String(dbPort) },
    stdio: ["ignore", log, log],
  });
}

async function waitHealthy(url: string) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if ((await fetch(`${url}/api/health`).catch(() => null))?.status === 200) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not become healthy`);
}

/** next-auth credentials sign-in with plain fetch; returns the Cookie header of the session. */
async function signIn(base: string, email: string, password: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair!.indexOf("=");
      jar.set(pair!.slice(0, i), pair!.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrf = await fetch(`${base}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie() },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: "/dashboard" }),
    redirect: "manual",
  });
  keep(res);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`sign-in failed on ${base}`);
  return cookie();
}

const percentile = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))]!;
};

type Result = { medianMs: number; p95Ms: number; perSecond: number; errors: number };

/** Sequential stock changes alternating over `bases`, then a timed burst of check-page reads. */
async function measure(bases: string[], dbPort: number): Promise<Result> {
  const pool = mysql.createPool({
    host: "127.0.0.1",
    port: dbPort,
    user: process.env.DB_USER ?? "forkwall",
    password: process.env.DB_PASSWORD,
    database: DB_NAME,
    connectionLimit: 1,
  });
  const [[balloon]] = (await pool.query(
    "SELECT b.id FROM balloons b JOIN balloon_families f ON f.id = b.family_id JOIN labs l ON l.id = f.lab_id WHERE l.slug = 'demo' AND f.name = 'NC family A (illustrative)' AND b.diameter_mm = 3.75",
  )) as unknown as [{ id: number }[]];
  const [[edition]] = (await pool.query(
    "SELECT e.check_token AS token FROM editions e JOIN labs l ON l.id = e.lab_id WHERE l.slug = 'demo' AND e.status = 'approved' ORDER BY e.id LIMIT 1",
  )) as unknown as [{ token: string }[]];
  await pool.end();
  const cookies = await Promise.all(bases.map((b) => signIn(b, "manager@forkwall.test", "forkwall-demo-2026")));
  let errors = 0;
  const latencies: number[] = [];
  for (let i = 0; i < CHANGES; i++) {
    const k = i % bases.length;
    const t0 = performance.now();
    const res = await fetch(`${bases[k]}/api/v1/labs/demo/stock/balloons/${balloon!.id}`, {
      method: "PATCH",
      headers: { "content-type": "application/json", cookie: cookies[k]! },
      body: JSON.stringify({ inStock: i % 2 === 1 }),
    });
    await res.arrayBuffer();
    latencies.push(performance.now() - t0);
    if (res.status !== 200) errors++;
  }
  // Warm the page on every instance, then read it for SECONDS from CONCURRENCY loops.
  for (const b of bases) await (await fetch(`${b}/v/${edition!.token}`)).arrayBuffer();
  let done = 0;
  const until = Date.now() + SECONDS * 1000;
  await Promise.all(
    Array.from({ length: CONCURRENCY }, async (_, w) => {
      const base = bases[w % bases.length]!;
      while (Date.now() < until) {
        const res = await fetch(`${base}/v/${edition!.token}`);
        await res.arrayBuffer();
        if (res.status === 200) done++;
        else errors++;
      }
    }),
  );
  return {
    medianMs: Math.round(percentile(latencies, 50)),
    p95Ms: Math.round(percentile(latencies, 95)),
    perSecond: Math.round((done / SECONDS) * 10) / 10,
    errors,
  };
}

const dist = process.env.NEXT_DIST_DIR!;
if (!existsSync(path.join(dist, "BUILD_ID"))) {
  say(`production build into ${dist}`);
  await exec(["node_modules/next/dist/bin/next", "build"], {});
}
const { startFakeMail, fakeMailPorts } = await import("@/lib/mail/fake-server");
const mail = await startFakeMail(
  fakeMailPorts(process.env.SMTP_URL!, process.env.MAIL_FAKE_URL!, process.env.MAIL_FAKE_SECRET!),
);
const A = `http://localhost:${portA}`;
const B = `http://localhost:${portB}`;
const children: ChildProcess[] = [];
const singleWasUp = await local.isRunning(local.localServer({ port: singlePort }));
const clusterWasUp = (await Promise.all(nodes.map((n) => local.isRunning(n)))).some(Boolean);
let single: Result | undefined;
let cluster: Result | undefined;
try {
  say(`single server: MariaDB on ${singlePort}, one instance`);
  await exec(tsx("db/start.ts", "up"), { DB_PORT: String(singlePort) });
  children.push(instance("single", portA, singlePort));
  await waitHealthy(A);
  single = await measure([A], singlePort);
  children.pop()!.kill("SIGTERM");
  await new Promise((r) => setTimeout(r, 1000));

  say("cluster: three Galera nodes, instance A on node1, B on node2");
  await exec(tsx("db/cluster-cmd.ts", "up"), {});
  children.push(instance("a", portA, nodes[0]!.port), instance("b", portB, nodes[1]!.port));
  await Promise.all([waitHealthy(A), waitHealthy(B)]);
  cluster = await measure([A, B], nodes[0]!.port);
} finally {
  for (const c of children) if (c.exitCode === null) c.kill("SIGTERM");
  await mail.close();
  if (!singleWasUp) await local.stop(local.localServer({ port: singlePort }));
  if (!clusterWasUp) await clusterDown();
}

const ratio = (x: number, y: number) => (y === 0 ? "n/a" : (x / y).toFixed(2));
console.log(
  `\n${CHANGES} sequential stock changes; check page /v/<token> read for ${SECONDS} s by ${CONCURRENCY} loops`,
);
console.log("setup                          change median  change p95  check pages/s  errors");
for (const [name, r] of [
  ["single server, one instance", single!],
  ["Galera cluster, two instances", cluster!],
] as const) {
  console.log(
    `${name.padEnd(30)} ${`${r.medianMs} ms`.padStart(13)}  ${`${r.p95Ms} ms`.padStart(10)}  ${String(r.perSecond).padStart(13)}  ${String(r.errors).padStart(6)}`,
  );
}
console.log(
  `ratio cluster / single:        ${ratio(cluster!.medianMs, single!.medianMs).padStart(13)}  ${ratio(cluster!.p95Ms, single!.p95Ms).padStart(10)}  ${ratio(cluster!.perSecond, single!.perSecond).padStart(13)}`,
);
process.exit(0);
