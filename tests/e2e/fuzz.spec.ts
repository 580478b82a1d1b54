// Property-based fuzzing of every JSON route (fast-check): generated bodies and query strings,
// sent as anonymous and as each demo role along the rows of tests/authz/matrix.ts. No answer
// may be a 5xx, and a refused request (4xx) must change nothing in the database.
// A generated body is sometimes valid (an empty object withdraws an edition), so the fuzz runs
// in a lab of its own with people of its own (support/fuzz-lab.ts): any order of files works.
import { execFileSync } from "node:child_process";
import { expect, test } from "@playwright/test";
import fc from "fast-check";
import { ALL_ROLES, ROUTES, type Actor, type RouteRow } from "../authz/matrix";
import { DEMO_PASSWORD, signInApi } from "./support/auth";
import { until } from "../support/poll";
import { closeDb, demoIds, query } from "./support/db";

const ACTORS: Actor[] = ["anonymous", ...ALL_ROLES];
const RUNS_PER_ROW = 8;
// Counted per address by the server: tables that legitimately change on any request.
const VOLATILE = new Set(["rate_limits"]);

let ids: Record<string, number | string>;
let lab: { slug: string; emails: Record<string, string> };
/** The matrix's demo-lab URLs, pointed at the fuzz's own lab. */
const inFuzzLab = (url: string) => url.replace(/\/labs\/demo(?=[/?]|$)/, `/labs/${lab.slug}`);
let tables: string[];
let total = 0;
const statusCount = new Map<number, number>();

test.beforeAll(async () => {
  lab = JSON.parse(
    execFileSync(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/e2e/support/fuzz-lab.ts"], {
      encoding: "utf8",
    })
      .trim()
      .split("\n")
      .at(-1)!,
  ) as typeof lab;
  ids = await demoIds(lab.slug, lab.emails.manager!.replace("manager", "%"));
  for (const role of ALL_ROLES) ids[`demo:${role}`] = ids[`${lab.slug}:${role}`]!;
  tables = (
    await query<{ t: string }>(
      "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY 1",
    )
  )
    .map((r) => r.t)
    .filter((t) => !VOLATILE.has(t));
});
test.afterAll(async () => {
  console.log(
    `fuzz: ${total} generated requests; statuses ${[...statusCount].map(([s, n]) => `${s}x${n}`).join(", ")}`,
  );
  await closeDb();
});

async function fingerprint(): Promise<string> {
  const rows = await query<{ Table: string; Checksum: number | null }>(
    `CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(", ")}`,
  );
  return rows.map((r) => `${r.Table}:${r.Checksum}`).join("|");
}

/** The fingerprint once two reads in a row agree (work an accepted request finishes after answering). */
async function settled(): Promise<string> {
  let last = await fingerprint();
  return until("the database to settle", fingerprint, (now) => now === last || ((last = now), false), {
    everyMs: 100,
  });
}

// Text that has broken or hidden things before: lone surrogates, NUL, bidi overrides, huge numbers.
const nasty = fc.oneof(
  fc.string(),
  fc.string({ unit: fc.integer({ min: 0, max: 0xffff }).map((c) => String.fromCharCode(c)), maxLength: 12 }),
  fc.constantFrom(
    "\uD800",
    "a\u0000b",
    "\u202Egnp",
    "=HYPERLINK(1)",
    "../../etc/passwd",
    "DEMO",
    "demo\u0000",
    "1e309",
    "-0",
    "NaN",
  ),
);
const value: fc.Arbitrary<unknown> = fc.oneof(
  { depthSize: "small" },
  nasty,
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
  fc.jsonValue({ maxDepth: 2 }),
);
const FIELDS = [
  "name",
  "title",
  "notes",
  "reason",
  "role",
  "email",
  "roomId",
  "law",
  "readingDistanceM",
  "paper",
  "diameterMm",
  "inStock",
  "compliance",
  "nominalAtm",
  "rbpAtm",
  "familyId",
  "lookups",
  "ratio",
  "n",
  "limit",
  "before",
];
const body = fc.oneof(
  fc.record(Object.fromEntries(FIELDS.map((f) => [f, value])), { requiredKeys: [] }),
  fc.jsonValue({ maxDepth: 3 }),
  fc.constant(undefined),
);
const queryString = fc.dictionary(
  fc.oneof(fc.constantFrom(...FIELDS, "mb", "sb", "parent", "dryRun", "revision"), fc.string({ maxLength: 6 })),
  fc.oneof(nasty, fc.integer().map(String)),
  { maxKeys: 4 },
);
const rawBody = fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom("{", '{"a":', "[]", "null", '"\\ud800"'));

const rows = ROUTES.filter(
  (r): r is RouteRow & { expect: Record<Actor, number> } =>
    r.kind === "route" &&
    !r.exempt &&
    r.url !== undefined &&
    // JSON routes only: the check page and short code (phone) answer HTML.
    r.route.startsWith("/api/") &&
    (typeof r.url === "function" || r.url.startsWith("/api/v1/")),
);

for (const actor of ACTORS) {
  test(`as ${actor}, generated requests to every JSON route answer below 500 and refusals change nothing`, async ({
    playwright,
    baseURL,
  }) => {
    test.setTimeout(300_000);
    const request = await playwright.request.newContext({ baseURL });
    if (actor !== "anonymous") await signInApi(request, lab.emails[actor]!, DEMO_PASSWORD);
    let before = await fingerprint();
    const problems: string[] = [];
    const ip = () => `198.18.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250) + 1}`;
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...rows),
        body,
        rawBody,
        fc.boolean(),
        queryString,
        async (row, json, raw, sendRaw, q) => {
          const base = inFuzzLab(typeof row.url === "function" ? row.url(ids) : row.url);
          const qs = new URLSearchParams(q).toString();
          const url = qs ? `${base}${base.includes("?") ? "&" : "?"}${qs}` : base;
          const write = row.method !== "GET";
          const res = await request.fetch(url, {
            method: row.method,
            headers: {
              "x-forwarded-for": ip(),
              ...(write ? { "content-type": sendRaw ? "text/plain" : "application/json" } : {}),
            },
            ...(write ? { data: sendRaw ? raw : json === undefined ? "" : JSON.stringify(json) } : {}),
            maxRedirects: 0,
          });
          total++;
          const status = res.status();
          statusCount.set(status, (statusCount.get(status) ?? 0) + 1);
          const text = await res.text();
          if (status >= 500) problems.push(`${row.method} ${url} -> ${status} ${text.slice(0, 120)}`);
          expect(status, `${row.method} ${url}: ${text.slice(0, 200)}`).toBeLessThan(500);
          if (status >= 400) {
            const now = await fingerprint();
            expect(now, `${row.method} ${url} was refused (${status}) but changed the database`).toBe(before);
          } else {
            // Accepted requests may write (a PDF download is audited; writes finish
            // work after answering, like stale-notice e-mail): let it settle, then re-baseline.
            before = await settled();
          }
        },
      ),
      { numRuns: rows.length * RUNS_PER_ROW, seed: Number(process.env.FUZZ_SEED ?? 20261202), endOnFailure: true },
    );
    expect(problems).toEqual([]);
    await request.dispose();
  });
}

test("the fuzz walked at least 2,000 generated requests", () => {
  console.log(`fuzz total: ${total} requests`);
  expect(total).toBeGreaterThanOrEqual(2000);
});
