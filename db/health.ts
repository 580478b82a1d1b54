import mysql, { type Pool } from "mysql2/promise";

/** A real round trip to the database, given up after `timeoutMs` so health answers fast. */
export async function checkDatabase(pool: Pool, timeoutMs = 1500): Promise<"ok" | "down"> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<"down">((resolve) => {
    timer = setTimeout(() => resolve("down"), timeoutMs);
  });
  const probe = pool
    .query({ sql: "SELECT 1 AS ok", timeout: timeoutMs })
    .then(() => "ok" as const)
    .catch(() => "down" as const);
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

export async function healthResponse(pool: Pool): Promise<Response> {
  const db = await checkDatabase(pool);
  const headers = { "cache-control": "no-store" };
  return db === "ok"
    ? Response.json({ status: "ok", db: "ok" }, { status: 200, headers })
    : Response.json({ status: "degraded", db: "down" }, { status: 503, headers });
}

// The page-request probe of proxy.ts: a pool of its own (the proxy is bundled apart from the
// pages), two connections at most, and a short memory of success so a busy minute costs few
// round trips. A failure is never remembered: the next request probes again, so pages recover
// as soon as the database is back.
let probePool: Pool | undefined;
let lastOkAt = 0;
const OK_MEMORY_MS = 1000;

export async function databaseReachable(uri: string, now = Date.now()): Promise<boolean> {
  if (now - lastOkAt < OK_MEMORY_MS) return true;
  probePool ??= mysql.createPool({ uri, connectionLimit: 2, connectTimeout: 1500, enableKeepAlive: true });
  const ok = (await checkDatabase(probePool)) === "ok";
  if (ok) lastOkAt = now;
  return ok;
}
