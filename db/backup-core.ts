// Backups of a Forkwall database: a consistent dump (mariadb-dump --single-transaction: one
// InnoDB snapshot, no table locks, so the app keeps running) compressed with gzip and named by
// date, and a restore that refuses any database that already holds tables.
import { spawn } from "node:child_process";
import { createReadStream, createWriteStream, existsSync, mkdirSync, renameSync } from "node:fs";
import path from "node:path";
import { pipeline } from "node:stream/promises";
import { createGunzip, createGzip } from "node:zlib";

export type DbTarget = { host: string; port: number; user: string; password: string; database: string };

const BIN_DIRS = ["/usr/bin", "/usr/local/bin", "/usr/sbin"];
function bin(name: string): string {
  for (const dir of BIN_DIRS) if (existsSync(path.join(dir, name))) return path.join(dir, name);
  throw new Error(`${name} not found: install Debian's mariadb-client`);
}

export function targetFromUrl(url: string): DbTarget {
  const u = new URL(url);
  return {
    host: u.hostname,
    port: Number(u.port || 3306),
    user: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: decodeURIComponent(u.pathname.replace(/^\//, "")),
  };
}

// The password goes through MYSQL_PWD, never the command line (other users can read argv).
const clientArgs = (t: DbTarget) => ["--no-defaults", `--host=${t.host}`, `--port=${t.port}`, `--user=${t.user}`];
const clientEnv = (t: DbTarget) => ({ ...process.env, MYSQL_PWD: t.password });

function exited(child: ReturnType<typeof spawn>, what: string): Promise<void> {
  let err = "";
  child.stderr?.on("data", (d: Buffer) => (err += d.toString()));
  return new Promise((resolve, reject) =>
    child.on("close", (code) => (code === 0 ? resolve() : reject(new Error(`${what} exited ${code}: ${err.trim()}`)))),
  );
}

/** `<database>-YYYY-MM-DDTHH-MM-SS-mmmZ.sql.gz`: sorts by date, never overwrites. */
export function backupName(database: string, at = new Date()): string {
  return `${database}-${at.toISOString().replace(/[:.]/g, "-")}.sql.gz`;
}

export async function backupDatabase(t: DbTarget, dir: string): Promise<string> {
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  const file = path.join(dir, backupName(t.database));
  const partial = `${file}.partial`;
  const dump = spawn(
    bin("mariadb-dump"),
    [
      ...clientArgs(t),
      "--single-transaction",
      "--routines",
      "--triggers",
      "--events",
      "--hex-blob",
      "--skip-lock-tables",
      t.database,
    ],
    { env: clientEnv(t), stdio: ["ignore", "pipe", "pipe"] },
  );
  const done = exited(dump, "mariadb-dump");
  await Promise.all([
    pipeline(dump.stdout!, createGzip({ level: 6 }), createWriteStream(partial, { mode: 0o600 })),
    done,
  ]);
  renameSync(partial, file); // a half-written dump never carries the final name
  return file;
}

async function sql(t: DbTarget, statement: string): Promise<string> {
  const child = spawn(
    bin("mariadb"),
    [...clientArgs(t), "--batch", "--skip-column-names", "-e", statement, t.database],
    {
      env: clientEnv(t),
      stdio: ["ignore", "pipe", "pipe"],
    },
  );
  let out = "";
  child.stdout!.on("data", (d: Buffer) => (out += d.toString()));
  await exited(child, "mariadb");
  return out;
}

export async function tableCount(t: DbTarget): Promise<number> {
  return Number(
    (await sql(t, `SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = DATABASE()`)).trim(),
  );
}

/** Restores a dump into `t.database`, which must exist and hold no tables. */
export async function restoreDatabase(t: DbTarget, file: string): Promise<void> {
  if (!existsSync(file)) throw new Error(`no such backup: ${file}`);
  const tables = await tableCount(t);
  if (tables > 0) throw new Error(`${t.database} already holds ${tables} tables: restore only into an empty database`);
  const client = spawn(bin("mariadb"), [...clientArgs(t), t.database], {
    env: clientEnv(t),
    stdio: ["pipe", "ignore", "pipe"],
  });
  const done = exited(client, "mariadb");
  await Promise.all([pipeline(createReadStream(file), createGunzip(), client.stdin!), done]);
}
