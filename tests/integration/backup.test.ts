// Backups: `npm run db:backup` / `db:restore` round-trip the whole database (demo data, every
// table, the edition triggers), and a restore refuses a database that already holds tables.
import { existsSync, rmSync, statSync } from "node:fs";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import mysql from "mysql2/promise";
import { afterAll, describe, expect, it } from "vitest";
import { pool } from "@/db";
import { backupDatabase, restoreDatabase, targetFromUrl } from "@/db/backup-core";
import * as local from "@/db/local-server";
import { env } from "@/lib/env";

const dir = mkdtempSync(path.join(tmpdir(), "forkwall-backup-"));
const source = targetFromUrl(env.DATABASE_URL);
const copyName = `${source.database.replace(/_test$/, "")}_restore_test`;
const server = local.localServer({ port: env.DB_PORT });

afterAll(async () => {
  await local.rootSql(server, `DROP DATABASE IF EXISTS \`${copyName}\`;`);
  rmSync(dir, { recursive: true, force: true });
  await pool.end();
});

async function everyTable(conn: mysql.Connection, db: string) {
  const [tables] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? ORDER BY table_name",
    [db],
  );
  const out: Record<string, unknown[]> = {};
  for (const { t } of tables) {
    const [cols] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT COUNT(*) AS n FROM information_schema.columns WHERE table_schema = ? AND table_name = ?",
      [db, t],
    );
    const order = Array.from({ length: Number(cols[0]!.n) }, (_, i) => i + 1).join(", ");
    const [rows] = await conn.query(`SELECT * FROM \`${db}\`.\`${t}\` ORDER BY ${order}`);
    out[t as string] = rows as unknown[];
  }
  const [triggers] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT trigger_name AS n, action_statement AS s FROM information_schema.triggers WHERE trigger_schema = ? ORDER BY 1",
    [db],
  );
  return { tables: out, triggers };
}

describe("database backup and restore", () => {
  it("round-trips every table and trigger into an empty database", async () => {
    const file = await backupDatabase(source, dir);
    expect(path.basename(file)).toMatch(new RegExp(`^${source.database}-\\d{4}-\\d{2}-\\d{2}T[\\d-]+Z\\.sql\\.gz$`));
    expect(statSync(file).size).toBeGreaterThan(1000);
    expect(existsSync(`${file}.partial`)).toBe(false);

    await local.ensureDatabase(server, {
      database: copyName,
      user: env.DB_USER,
      password: env.DB_PASSWORD,
      fresh: true,
    });
    await restoreDatabase({ ...source, database: copyName }, file);

    const conn = await mysql.createConnection({ ...source, database: undefined });
    try {
      const [a, b] = [await everyTable(conn, source.database), await everyTable(conn, copyName)];
      expect(Object.keys(a.tables).length).toBeGreaterThan(10);
      expect(a.tables.labs!.length, "the demo labs are in the dump").toBeGreaterThan(0);
      expect(Object.keys(b.tables)).toEqual(Object.keys(a.tables));
      for (const t of Object.keys(a.tables)) expect(b.tables[t], t).toEqual(a.tables[t]);
      expect(b.triggers).toEqual(a.triggers);
      expect(a.triggers.length).toBeGreaterThan(0);
    } finally {
      await conn.end();
    }

    // Restoring again into the now-populated copy is refused, and changes nothing.
    await expect(restoreDatabase({ ...source, database: copyName }, file)).rejects.toThrow(/empty database/);
  });
});
