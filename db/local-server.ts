// The project's own MariaDB: a private data directory under .data/, bound to loopback on a
// project port with its own socket, so a system-wide instance is never touched.
import { execFile, spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, openSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";

const run = promisify(execFile);

export type LocalServer = {
  dataDir: string;
  socket: string;
  pidFile: string;
  logFile: string;
  port: number;
};

const BIN_DIRS = ["/usr/sbin", "/usr/bin", "/usr/local/sbin", "/usr/local/bin"];

export function bin(name: string): string {
  for (const dir of BIN_DIRS) {
    const file = path.join(dir, name);
    if (existsSync(file)) return file;
  }
  throw new Error(`${name} not found: install Debian's mariadb-server and mariadb-client`);
}

export function localServer(opts: { root?: string; port: number; name?: string }): LocalServer {
  const root = path.resolve(opts.root ?? process.cwd(), ".data");
  const name = opts.name ?? "mariadb";
  const dataDir = path.join(root, name);
  let socket = path.join(root, `${name}.sock`);
  // Unix socket paths are limited to 107 bytes; deep checkouts fall back to /tmp.
  if (socket.length > 100) {
    socket = path.join(os.tmpdir(), `forkwall-${createHash("sha1").update(socket).digest("hex").slice(0, 12)}.sock`);
  }
  return {
    dataDir,
    socket,
    pidFile: path.join(root, `${name}.pid`),
    logFile: path.join(root, `${name}.err`),
    port: opts.port,
  };
}

const osUser = () => os.userInfo().username;

async function ping(server: LocalServer): Promise<boolean> {
  try {
    await run(bin("mariadb-admin"), [
      "--no-defaults",
      `--socket=${server.socket}`,
      `-u${osUser()}`,
      "--connect-timeout=2",
      "ping",
    ]);
    return true;
  } catch {
    return false;
  }
}

export async function isRunning(server: LocalServer): Promise<boolean> {
  return ping(server);
}

export async function initIfNeeded(server: LocalServer): Promise<boolean> {
  if (existsSync(path.join(server.dataDir, "mysql"))) return false;
  mkdirSync(server.dataDir, { recursive: true });
  await run(bin("mariadb-install-db"), [
    "--no-defaults",
    `--user=${osUser()}`,
    `--datadir=${server.dataDir}`,
    "--skip-test-db",
    "--auth-root-authentication-method=socket",
  ]);
  return true;
}

export async function start(server: LocalServer): Promise<"started" | "running"> {
  if (await ping(server)) return "running";
  await initIfNeeded(server);
  const log = openSync(server.logFile, "a");
  const child = spawn(
    bin("mariadbd"),
    [
      "--no-defaults",
      `--user=${osUser()}`,
      `--datadir=${server.dataDir}`,
      `--socket=${server.socket}`,
      `--pid-file=${server.pidFile}`,
      `--port=${server.port}`,
      "--bind-address=127.0.0.1",
      "--skip-name-resolve",
      "--default-time-zone=+00:00",
      "--character-set-server=utf8mb4",
      "--collation-server=utf8mb4_unicode_ci",
      "--innodb-buffer-pool-size=128M",
      `--log-error=${server.logFile}`,
    ],
    { detached: true, stdio: ["ignore", log, log] },
  );
  child.unref();
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    if (await ping(server)) return "started";
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`MariaDB did not start on port ${server.port}; see ${server.logFile}`);
}

export async function stop(server: LocalServer): Promise<boolean> {
  if (!(await ping(server))) return false;
  await run(bin("mariadb-admin"), ["--no-defaults", `--socket=${server.socket}`, `-u${osUser()}`, "shutdown"]);
  return true;
}

export async function rootSql(server: LocalServer, statements: string): Promise<string> {
  const { stdout } = await run(bin("mariadb"), [
    "--no-defaults",
    `--socket=${server.socket}`,
    `-u${osUser()}`,
    "--batch",
    "--skip-column-names",
    "-e",
    statements,
  ]);
  return stdout;
}

const ident = (s: string) => {
  if (!/^[A-Za-z0-9_]+$/.test(s)) throw new Error(`unsafe identifier: ${s}`);
  return s;
};
const literal = (s: string) => `'${s.replace(/\\/g, "\\\\").replace(/'/g, "''")}'`;

/** Creates the database (dropping it first when `fresh`) and grants the app user on it. */
export async function ensureDatabase(
  server: LocalServer,
  opts: { database: string; user: string; password: string; fresh?: boolean },
): Promise<void> {
  const db = ident(opts.database);
  const user = `${literal(opts.user)}@'127.0.0.1'`;
  await rootSql(
    server,
    [
      opts.fresh ? `DROP DATABASE IF EXISTS \`${db}\`;` : "",
      `CREATE DATABASE IF NOT EXISTS \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
      `CREATE USER IF NOT EXISTS ${user} IDENTIFIED BY ${literal(opts.password)};`,
      `ALTER USER ${user} IDENTIFIED BY ${literal(opts.password)};`,
      `GRANT ALL PRIVILEGES ON \`${db}\`.* TO ${user};`,
    ].join("\n"),
  );
}
