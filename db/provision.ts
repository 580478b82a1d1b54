// Shared by `npm start` and `npm test`: the project's MariaDB up, the database created (fresh
// when asked), migrations applied, the demo lab seeded.
import type { Env } from "@/lib/env";
import * as local from "./local-server";

/** On a running server (one MariaDB, or a cluster's first node): database and user, migrations, demo seed. */
export async function prepareDatabase(
  server: local.LocalServer,
  env: Env,
  opts: { fresh?: boolean; seed?: boolean } = {},
) {
  await local.ensureDatabase(server, {
    database: env.DB_NAME,
    user: env.DB_USER,
    password: env.DB_PASSWORD,
    fresh: opts.fresh,
  });
  // The process-wide pool: the seed goes through the app's own query functions, which use it.
  const { db, pool } = await import("./index");
  const { runMigrations } = await import("./migrate");
  try {
    await runMigrations(db);
    if (opts.seed !== false) await (await import("./seed")).seedDemo(db);
  } finally {
    await pool.end();
  }
}

export async function provision(env: Env, opts: { fresh?: boolean; log?: (msg: string) => void } = {}) {
  const log = opts.log ?? (() => {});
  const t0 = Date.now();
  const server = local.localServer({ port: env.DB_PORT });
  const state = await local.start(server);
  log(`MariaDB ${state} on 127.0.0.1:${env.DB_PORT} (data in ${server.dataDir})`);
  await prepareDatabase(server, env, { fresh: opts.fresh });
  log(`database ${env.DB_NAME} migrated and seeded in ${Date.now() - t0} ms`);
  return { server, startedHere: state === "started" };
}
