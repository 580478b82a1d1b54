import { defineConfig } from "drizzle-kit";

// Only `drizzle-kit generate` uses this; migrations are applied by db/migrate.ts.
export default defineConfig({
  dialect: "mysql",
  schema: "./db/schema.ts",
  out: "./drizzle",
  casing: "snake_case",
});
