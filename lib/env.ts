// The one place that reads process.env; everything else imports `env`.
import { parseEnv, type Env } from "./env-schema";

export type { Env };
export { parseEnv };

function load(): Env {
  const parsed = parseEnv(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  return parsed.data;
}

export const env = load();
