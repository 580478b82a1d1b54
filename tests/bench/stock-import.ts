// `npm run bench:stock`: how long a CSV of the 5,000-row limit takes to parse, preview (dry run)
// and apply, on a bench database of the project's MariaDB that is dropped afterwards. Prints
// figures; asserts nothing about speed (the correctness of the same import is in
// tests/integration/stock.test.ts).
import { performance } from "node:perf_hooks";
import { loadLocalEnv } from "../../db/local-env";

const RUNS = 3;
const database = "forkwall_bench";
process.env.DB_NAME = database;
loadLocalEnv();

const { env } = await import("../../lib/env");
const local = await import("../../db/local-server");
const server = local.localServer({ port: env.DB_PORT });
const state = await local.start(server);
await local.ensureDatabase(server, { database, user: env.DB_USER, password: env.DB_PASSWORD, fresh: true });

const { db, pool } = await import("../../db/index");
const { runMigrations } = await import("../../db/migrate");
const { importStock, previewStockImport } = await import("../../db/queries/stock-import");
const { labWrite } = await import("../../lib/ops/write");
const { labs, users } = await import("../../db/schema");
const { parseBalloonCsv } = await import("../../lib/stock/csv");

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

function file(run: number): string {
  const lines = ["family,compliance,diameter_mm,in_stock,nominal_atm,rbp_atm"];
  for (let f = 0; f < 50; f++)
    for (let i = 0; i < 100; i++)
      lines.push(`Bench ${run}-${f} (illustrative),nc,${(1 + i * 0.05).toFixed(2)},${i % 7 ? "yes" : "no"},12,20`);
  return lines.join("\n");
}

try {
  await runMigrations(db);
  const [user] = await db
    .insert(users)
    .values({ email: "bench@forkwall.test", name: "Bench", passwordHash: "x" })
    .$returningId();
  const figures = { parse: [] as number[], dryRun: [] as number[], apply: [] as number[] };
  for (let run = 0; run < RUNS; run++) {
    // A new lab each run, so every run adds 5,000 sizes to an empty stock.
    const [lab] = await db
      .insert(labs)
      .values({ slug: `bench-${run}`, name: `Bench lab ${run} (illustrative)` })
      .$returningId();
    const actor = { labId: lab!.id, actorUserId: user!.id };
    const t0 = performance.now();
    const { rows, issues } = parseBalloonCsv(file(run));
    if (issues.length) throw new Error(`bench file refused: ${issues[0]!.message}`);
    const t1 = performance.now();
    const preview = await previewStockImport({ labId: actor.labId, rows });
    const t2 = performance.now();
    const result = await labWrite(actor.labId, (tx) =>
      importStock(tx, { ...actor, rows, expectRevision: preview.revision }),
    );
    const t3 = performance.now();
    if (result.plan.balloonsToAdd.length !== 5000) throw new Error("bench import did not add 5,000 sizes");
    figures.parse.push(t1 - t0);
    figures.dryRun.push(t2 - t1);
    figures.apply.push(t3 - t2);
  }
  console.log(`5,000-row CSV import, median of ${RUNS} runs:`);
  for (const [step, ms] of Object.entries(figures)) console.log(`  ${step.padEnd(7)} ${Math.round(median(ms))} ms`);
} finally {
  await pool.end();
  await local.rootSql(server, `DROP DATABASE IF EXISTS \`${database}\`;`);
  if (state === "started") await local.stop(server);
}
