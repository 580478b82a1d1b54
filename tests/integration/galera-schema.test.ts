// What a Galera cluster requires of the schema: only InnoDB tables are replicated, a table
// without a primary key replicates row changes unreliably (and cannot be certified), and table
// locks are not replicated. Checked on the migrated test database and in the migration files.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { pool } from "@/db";
import { env } from "@/lib/env";

type Row = { table_name: string; engine: string | null };

describe("schema fits a Galera cluster", () => {
  it("every table is InnoDB and has a primary key", async () => {
    const [tables] = (await pool.query(
      "SELECT table_name AS table_name, engine AS engine FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE'",
      [env.DB_NAME],
    )) as unknown as [Row[]];
    const [keyed] = (await pool.query(
      "SELECT DISTINCT table_name AS table_name FROM information_schema.table_constraints WHERE table_schema = ? AND constraint_type = 'PRIMARY KEY'",
      [env.DB_NAME],
    )) as unknown as [{ table_name: string }[]];
    expect(tables.length).toBeGreaterThan(10);
    const withKey = new Set(keyed.map((k) => k.table_name));
    expect(tables.filter((t) => !withKey.has(t.table_name)).map((t) => t.table_name)).toEqual([]);
    expect(tables.filter((t) => t.engine !== "InnoDB").map((t) => `${t.table_name}:${t.engine}`)).toEqual([]);
  });

  it("no migration locks tables or names another storage engine", () => {
    const dir = path.join(process.cwd(), "drizzle");
    const files = readdirSync(dir).filter((f) => f.endsWith(".sql"));
    expect(files.length).toBeGreaterThan(0);
    for (const file of files) {
      const text = readFileSync(path.join(dir, file), "utf8").replace(/--.*$/gm, "");
      expect(text, file).not.toMatch(/\bLOCK\s+TABLES?\b/i);
      expect(text, file).not.toMatch(/\bENGINE\s*=\s*(?!InnoDB\b)\w+/i);
      expect(text, file).not.toMatch(/\bFLUSH\s+TABLES\b.*\bREAD\s+LOCK\b/i);
    }
  });
});
