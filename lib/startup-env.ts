import { parseEnv } from "./env-schema";

/** Stops the process with each bad variable and its reason, instead of serving 500s. */
export function exitOnInvalidEnvironment(source: Record<string, string | undefined> = process.env): void {
  const parsed = parseEnv(source);
  if (parsed.success) return;
  const lines = parsed.error.issues.map((i) => `  ${i.path.join(".") || "(environment)"}: ${i.message}`);
  console.error(`Forkwall cannot start: invalid environment\n${lines.join("\n")}`);
  process.exit(1);
}
