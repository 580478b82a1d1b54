import type { Pool } from "mysql2/promise";

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
