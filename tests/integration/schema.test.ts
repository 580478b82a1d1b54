import { execFileSync } from "node:child_process";
import { cpSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { getTableName, is } from "drizzle-orm";
import { MySqlTable } from "drizzle-orm/mysql-core";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import * as schema from "@/db/schema";
import { seedDemo } from "@/db/seed";

afterAll(() => pool.end());

describe("schema and migrations", () => {
  it("drizzle-kit finds nothing to generate: the committed migrations match db/schema.ts", () => {
    const out = mkdtempSync(path.join(os.tmpdir(), "forkwall-drift-"));
    try {
      cpSync("drizzle", out, { recursive: true });
      const before = readdirSync(out).filter((f) => f.endsWith(".sql")).length;
      execFileSync(
        "node_modules/.bin/drizzle-kit",
        ["generate", "--dialect=mysql", "--schema=db/schema.ts", `--out=${out}`],
        { stdio: "pipe" },
      );
      const after = readdirSync(out).filter((f) => f.endsWith(".sql")).length;
      expect(after, "schema changed without a migration: run `npm run db:generate`").toBe(before);
    } finally {
      rmSync(out, { recursive: true, force: true });
    }
  }, 60_000);

  it("the migrated test database has every table the schema declares", async () => {
    const declared = Object.values(schema)
      .filter((v) => is(v, MySqlTable))
      .map((t) => getTableName(t as MySqlTable))
      .sort();
    const [rows] = await pool.query(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()",
    );
    const actual = (rows as { name: string }[]).map((r) => r.name).filter((n) => n !== "__drizzle_migrations");
    expect(actual.sort()).toEqual(declared);
  });

  it("seeding the demo lab twice adds no duplicates", async () => {
    const count = async () => {
      const out: Record<string, number> = {};
      for (const table of [
        "users",
        "labs",
        "memberships",
        "balloon_families",
        "balloons",
        "stent_platforms",
        "charts",
        "editions",
        "rooms",
      ]) {
        const [rows] = await pool.query(`SELECT COUNT(*) AS n FROM \`${table}\``);
        out[table] = Number((rows as { n: number }[])[0]!.n);
      }
      return out;
    };
    await seedDemo(db);
    const first = await count();
    await seedDemo(db);
    expect(await count()).toEqual(first);
    expect(first.labs).toBeGreaterThanOrEqual(2);
    expect(first.users).toBeGreaterThanOrEqual(4);
  }, 30_000);
});
