// Applies the committed migrations in drizzle/ (the programmatic migrator shows real errors).
import path from "node:path";
import { migrate } from "drizzle-orm/mysql2/migrator";
import type { Database } from "./index";

export async function runMigrations(database: Database): Promise<void> {
  await migrate(database, { migrationsFolder: path.join(process.cwd(), "drizzle") });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { db, pool } = await import("./index");
  await runMigrations(db);
  await pool.end();
  console.log("migrations applied");
}
