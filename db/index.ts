import { drizzle, type MySql2Database } from "drizzle-orm/mysql2";
import mysql from "mysql2/promise";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Database = MySql2Database<typeof schema>;

export function createPool(uri: string) {
  const pool = mysql.createPool({
    uri,
    connectionLimit: 10,
    connectTimeout: 1500,
    enableKeepAlive: true,
    timezone: "Z",
    supportBigNumbers: true,
  });
  // Dates are stored and read as UTC whatever the server's own zone is.
  pool.on("connection", (conn) => {
    conn.query("SET time_zone = '+00:00'");
  });
  return pool;
}

export function createDb(pool: mysql.Pool): Database {
  return drizzle({ client: pool, schema, mode: "default", casing: "snake_case" });
}

// One pool per process, kept across hot reloads in development.
const globalForDb = globalThis as unknown as { forkwallPool?: mysql.Pool };
export const pool = globalForDb.forkwallPool ?? createPool(env.DATABASE_URL);
if (env.NODE_ENV !== "production") globalForDb.forkwallPool = pool;

export const db = createDb(pool);
export { schema };
