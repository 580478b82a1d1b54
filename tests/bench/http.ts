// `npm run bench` (second part; `npm run bench:http` alone): what a phone scanning a poster costs
// the server. A production build in its own folder served by server.mjs on a throwaway
// `forkwall_bench_http` database with the demo data; then
// - the first-visit transfer of each page an operator opens (/, /sign-in, /calculator, a wall
//   view and the wall-chart list signed in as the demo operator, the check page), and of an
//   anonymous scan of /v/<token>: the page and everything it links (styles, scripts, fonts,
//   icon), each fetched as a browser would with `Accept-Encoding: gzip`;
// - autocannon, 16 connections, in one run: /icon.svg (a static file), /v/<token>, /calculator;
//   each with its throughput and its ratio to the static file.
// It asserts no speed: the figures go into README "Speed".
import { spawn, type ChildProcess } from "node:child_process";
import { request } from "node:http";
import { setTimeout as sleep } from "node:timers/promises";
import autocannon from "autocannon";
import mysql from "mysql2/promise";
import { loadLocalEnv } from "../../db/local-env";

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 16;
const port = Number(process.env.BENCH_HTTP_PORT ?? Number(process.env.PORT ?? 3000) + 10);
Object.assign(process.env, {
  DB_NAME: "forkwall_bench_http",
  PORT: String(port),
  APP_URL: `http://localhost:${port}`,
  // BENCH_REUSE_BUILD=<folder> serves an existing production build instead of building one.
  NEXT_DIST_DIR: process.env.BENCH_REUSE_BUILD ?? ".next-bench",
  LOG_LEVEL: "warn",
  // Every request comes from one address; the limit must not turn the bench into 429s.
  PUBLIC_RATE_LIMIT_PER_MINUTE: "1000000",
  NEXT_TELEMETRY_DISABLED: "1",
});
loadLocalEnv();
const { env } = await import("@/lib/env");
const { provision } = await import("../../db/provision");
const local = await import("../../db/local-server");

const say = (m: string) => console.log(`[bench:http] ${m}`);

function run(cmd: string, args: string[]): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: ["ignore", "ignore", "inherit"], env: process.env });
    child.on("exit", (code) => resolve(code ?? 1));
  });
}

type Got = { status: number; wire: number; encoding: string; body: Buffer; cookies: string[]; location?: string };

/** Bytes on the wire (body as sent, gzip when the server compresses) and the decoded text. */
function get(path: string, cookie = "", post?: string): Promise<Got> {
  return new Promise((resolve, reject) => {
    const headers: Record<string, string> = { "accept-encoding": "gzip", host: `localhost:${port}` };
    if (cookie) headers.cookie = cookie;
    if (post !== undefined) {
      headers["content-type"] = "application/x-www-form-urlencoded";
      headers.origin = `http://localhost:${port}`;
    }
    const req = request(
      { host: "127.0.0.1", port, path, method: post === undefined ? "GET" : "POST", headers },
      (res) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", async () => {
          const raw = Buffer.concat(chunks);
          const encoding = String(res.headers["content-encoding"] ?? "identity");
          const { gunzipSync } = await import("node:zlib");
          resolve({
            status: res.statusCode ?? 0,
            wire: raw.length,
            encoding,
            body: encoding === "gzip" ? gunzipSync(raw) : raw,
            cookies: (res.headers["set-cookie"] ?? []).map((c) => c.split(";")[0]!),
            location: res.headers.location,
          });
        });
      },
    );
    req.on("error", reject);
    req.end(post);
  });
}

/**
 * Every sub-resource a browser would fetch for a page: scripts, styles, preloads, icons, and
 * every font its CSS names (an upper bound: a browser fetches only the weights the page uses).
 */
async function transfer(path: string, cookie = "") {
  const page = await get(path, cookie);
  const html = page.body.toString("utf8");
  const refs = new Set<string>();
  for (const m of html.matchAll(/<(?:script|link)\b[^>]*?(?:src|href)="([^"]+)"/g)) {
    const url = m[1]!.replace(/&amp;/g, "&");
    if (url.startsWith("/") && !url.startsWith("//")) refs.add(url);
  }
  const items = [{ path, wire: page.wire, encoding: page.encoding }];
  const seen = new Set<string>();
  for (const ref of refs) {
    const r = await get(ref, cookie);
    items.push({ path: ref, wire: r.wire, encoding: r.encoding });
    if (ref.endsWith(".css"))
      for (const f of r.body.toString("utf8").matchAll(/url\(([^)]+\.(?:woff2?|ttf|otf))\)/g)) {
        const font = await get(f[1]!.replace(/["']/g, ""), cookie);
        if (seen.has(font.wire + f[1]!)) continue;
        seen.add(font.wire + f[1]!);
        items.push({ path: f[1]!, wire: font.wire, encoding: font.encoding });
      }
  }
  return { status: page.status, items, total: items.reduce((s, i) => s + i.wire, 0) };
}

/** A demo operator's session cookie, through next-auth's credentials endpoint. */
async function signIn(email: string, password: string): Promise<string> {
  const csrf = await get("/api/auth/csrf");
  const { csrfToken } = JSON.parse(csrf.body.toString("utf8")) as { csrfToken: string };
  const form = new URLSearchParams({ email, password, csrfToken, callbackUrl: "/dashboard" }).toString();
  const res = await get("/api/auth/callback/credentials", csrf.cookies.join("; "), form);
  const session = res.cookies.find((c) => /authjs\.session-token=/.test(c));
  if (!session) throw new Error(`sign-in failed (${res.status} ${res.location ?? ""})`);
  return session;
}

async function load(path: string, rotate: string[] = []) {
  const result = await autocannon({
    url: `http://127.0.0.1:${port}${path}`,
    connections: CONNECTIONS,
    duration: SECONDS,
    headers: { host: `localhost:${port}`, "accept-encoding": "gzip" },
    // Each connection walks the list in turn, so concurrent scans rarely share a token.
    ...(rotate.length > 0 ? { requests: rotate.map((p) => ({ method: "GET" as const, path: p })) } : {}),
  });
  return {
    path: rotate.length > 0 ? `/v/<${rotate.length} tokens in turn>` : path,
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors,
  };
}

let server: ChildProcess | null = null;
let startedDb = false;
try {
  say(`provisioning ${env.DB_NAME} (fresh, demo data)`);
  startedDb = (await provision(env, { fresh: true, log: () => undefined })).startedHere;
  if (process.env.BENCH_REUSE_BUILD) say(`serving the build in ${process.env.BENCH_REUSE_BUILD}`);
  else {
    say("building into .next-bench (next build)");
    const t0 = Date.now();
    if ((await run(process.execPath, ["node_modules/next/dist/bin/next", "build"])) !== 0)
      throw new Error("build failed");
    say(`built in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
  }

  server = spawn(process.execPath, ["server.mjs"], {
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...process.env, HOST: "127.0.0.1" },
  });
  for (let i = 0; ; i++) {
    const ok = await get("/api/health").then(
      (r) => r.status === 200,
      () => false,
    );
    if (ok) break;
    if (i > 120) throw new Error("server did not come up");
    await sleep(500);
  }

  const db = await mysql.createConnection({
    host: env.DB_HOST,
    port: env.DB_PORT,
    user: env.DB_USER,
    password: env.DB_PASSWORD,
    database: env.DB_NAME,
  });
  const [rows] = await db.query(
    "SELECT e.check_token AS token FROM editions e JOIN labs l ON l.id = e.lab_id WHERE l.slug = 'demo' ORDER BY e.status <> 'approved', e.id",
  );
  await db.end();
  const tokens = (rows as { token: string }[]).map((r) => `/v/${r.token}`);
  const check = tokens[0];
  if (!check) throw new Error("no approved demo edition");

  // Warm each path once so the first-request compile and caches do not count.
  for (const p of ["/icon.svg", ...tokens, "/calculator"]) await get(p);

  // First visits of the pages an operator opens (issue: each at most 200 KB gzip).
  const [chart] = (await (async () => {
    const c = await mysql.createConnection({
      host: env.DB_HOST,
      port: env.DB_PORT,
      user: env.DB_USER,
      password: env.DB_PASSWORD,
      database: env.DB_NAME,
    });
    const [r] = await c.query(
      "SELECT c.id FROM charts c JOIN labs l ON l.id = c.lab_id JOIN editions e ON e.chart_id = c.id AND e.status = 'approved' WHERE l.slug = 'demo' ORDER BY c.id LIMIT 1",
    );
    await c.end();
    return r;
  })()) as { id: number }[];
  const operator = await signIn("operator@forkwall.test", "forkwall-demo-2026");
  const wall = `/labs/demo/charts/${chart!.id}/wall`;
  await get(wall, operator);
  console.log("\noperator page (first visit)          gzip KB   files  limit 200 KB");
  for (const [name, p, cookie] of [
    ["/", "/", ""],
    ["/sign-in", "/sign-in", ""],
    ["/calculator", "/calculator", ""],
    ["wall view (signed in)", wall, operator],
    ["/labs/demo/wall (signed in)", "/labs/demo/wall", operator],
    ["check page /v/<token>", check, ""],
  ] as const) {
    const t = await transfer(p, cookie);
    const kb = t.total / 1024;
    console.log(
      `${name.padEnd(36)} ${kb.toFixed(1).padStart(7)} ${String(t.items.length).padStart(7)}  ${t.status === 200 ? (kb <= 200 ? "ok" : "OVER") : `status ${t.status}`}`,
    );
  }

  const scan = await transfer(check);
  say(`anonymous scan of /v/<token> (status ${scan.status}): ${(scan.total / 1024).toFixed(1)} KB on the wire`);
  for (const i of scan.items) say(`  ${i.path.slice(0, 60).padEnd(60)} ${String(i.wire).padStart(7)} B  ${i.encoding}`);
  const calc = await transfer("/calculator");
  say(`/calculator for comparison: ${(calc.total / 1024).toFixed(1)} KB in ${calc.items.length} files`);

  say(`autocannon: ${CONNECTIONS} connections, ${SECONDS} s per path, one after another on the same server`);
  const results = [];
  // The first /v/ run is the issue's measure (one poster scanned over and over); the second
  // spreads the scans over every demo edition, the case where no two scans share a lookup.
  const runs: [string, string[]?][] = [["/icon.svg"], [check], [check, tokens], ["/calculator"], ["/icon.svg"]];
  for (const [p, rotate] of runs) results.push(await load(p, rotate));
  // The static file's figure is the mean of its runs before and after, so drift counts against no one.
  const base = (results[0]!.rps + results[4]!.rps) / 2;
  console.log("\npath                             req/s   p50 ms   p99 ms   non-2xx  ratio to /icon.svg");
  for (const r of results.slice(0, 4)) {
    const name = r.path === check ? "/v/<token>" : r.path;
    console.log(
      `${name.padEnd(30)} ${r.rps.toFixed(0).padStart(7)} ${String(r.p50).padStart(8)} ${String(r.p99).padStart(8)} ${String(
        r.non2xx + r.errors,
      ).padStart(9)}  ${(r.rps / base).toFixed(2)}`,
    );
  }
  console.log(
    `\n/v/<token> throughput: ${((results[1]!.rps / base) * 100).toFixed(0)} % of /icon.svg (target at least 40 %), ` +
      `${((results[2]!.rps / base) * 100).toFixed(0)} % with every demo token in turn; ` +
      `scan transfer: ${(scan.total / 1024).toFixed(1)} KB gzip (target at most 50 KB)`,
  );
} finally {
  if (server) {
    server.kill("SIGTERM");
    await new Promise((r) => server!.once("exit", r));
  }
  if (startedDb) await local.stop(local.localServer({ port: env.DB_PORT }));
}
