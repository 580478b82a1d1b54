import { spawn } from "node:child_process";
import { expect, test } from "@playwright/test";

// Runs after the production build (tests/run.ts), so server.mjs gets as far as Next's start.
function run(cmd: string, args: string[], extra: Record<string, string>) {
  return new Promise<{ code: number | null; output: string }>((resolve, reject) => {
    const child = spawn(cmd, args, { env: { ...process.env, ...extra }, stdio: ["ignore", "pipe", "pipe"] });
    let output = "";
    child.stdout.on("data", (d) => (output += String(d)));
    child.stderr.on("data", (d) => (output += String(d)));
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
      reject(new Error(`still running after 60 s (it should have refused to start):\n${output}`));
    }, 60_000);
    child.on("exit", (code) => {
      clearTimeout(timer);
      resolve({ code, output });
    });
  });
}

test("server.mjs refuses to start with an invalid environment and names the variable", async () => {
  const port = String(Number(process.env.PORT ?? 3100) + 7);
  const { code, output } = await run(process.execPath, ["server.mjs"], {
    PORT: port,
    HOST: "127.0.0.1",
    PUBLIC_RATE_LIMIT_PER_MINUTE: "0",
  });
  expect(code).toBe(1);
  expect(output).toContain("PUBLIC_RATE_LIMIT_PER_MINUTE");
  expect(output).not.toContain(`Forkwall on http://127.0.0.1:${port}`);
});

test("npm start's entry point refuses an invalid environment before it provisions anything", async () => {
  const { code, output } = await run(process.execPath, ["--import", "tsx", "db/start.ts", "up"], {
    PUBLIC_RATE_LIMIT_PER_MINUTE: "0",
  });
  expect(code).toBe(1);
  expect(output).toMatch(/PUBLIC_RATE_LIMIT_PER_MINUTE: .*(>=|at least|too small)/i);
  expect(output).not.toContain("MariaDB");
});
