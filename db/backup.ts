// `npm run db:backup` writes .data/backups/<db>-<date>.sql.gz; `npm run db:restore <file>`
// restores one into an empty database (DB_NAME, or --into <name>; the project's local MariaDB
// creates it when missing).
import { loadLocalEnv } from "./local-env";

loadLocalEnv();
const { env } = await import("@/lib/env");
const local = await import("./local-server");
const { backupDatabase, restoreDatabase, targetFromUrl } = await import("./backup-core");

const [mode, ...args] = process.argv.slice(2);
const usesLocalServer = !process.env.DATABASE_URL;
const say = (msg: string) => console.log(`\x1b[36m[forkwall]\x1b[0m ${msg}`);

try {
  const server = local.localServer({ port: env.DB_PORT });
  if (usesLocalServer) await local.start(server);
  const target = targetFromUrl(env.DATABASE_URL);
  if (mode === "backup") {
    const file = await backupDatabase(target, ".data/backups");
    say(`backup of ${target.database} written to ${file}`);
  } else if (mode === "restore") {
    const file = args.find((a) => !a.startsWith("--"));
    if (!file) throw new Error("usage: npm run db:restore <file.sql.gz> [-- --into <database>]");
    const i = args.indexOf("--into");
    const into = i >= 0 ? args[i + 1] : undefined;
    const database = into ?? target.database;
    if (usesLocalServer) await local.ensureDatabase(server, { database, user: env.DB_USER, password: env.DB_PASSWORD });
    await restoreDatabase({ ...target, database }, file);
    say(`${file} restored into ${database}`);
  } else throw new Error(`unknown mode ${mode}`);
  process.exit(0);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
}
