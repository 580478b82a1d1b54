// `npm start` / `npm run dev` / `npm run db:stop`: the local stack in one process. Brings up the
// project's MariaDB and the mail fake, migrates, seeds the demo lab, builds and serves; Ctrl-C
// stops the web server and shuts the database down cleanly.
import { spawn, type ChildProcess } from "node:child_process";
import { loadLocalEnv } from "./local-env";

loadLocalEnv();
(await import("@/lib/startup-env")).exitOnInvalidEnvironment();
const { env } = await import("@/lib/env");
const local = await import("./local-server");
const { provision } = await import("./provision");

const mode = process.argv[2] ?? "serve";
const server = local.localServer({ port: env.DB_PORT });
const say = (msg: string) => console.log(`\x1b[36m[forkwall]\x1b[0m ${msg}`);

if (mode === "stop") {
  say((await local.stop(server)) ? "database stopped" : "database was not running");
  process.exit(0);
}

function runStep(cmd: string, args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: "inherit" });
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${cmd} ${args.join(" ")} exited ${code}`))));
  });
}

const nextBin = "node_modules/next/dist/bin/next";
let web: ChildProcess | null = null;
let mail: Awaited<ReturnType<typeof import("@/lib/mail/fake-server").startFakeMail>> | null = null;
let stopping = false;

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  say("stopping…");
  if (web && web.exitCode === null) {
    web.kill("SIGTERM");
    await new Promise((r) => web!.once("exit", r));
  }
  await mail?.close();
  if (await local.stop(server)) say("database stopped cleanly");
  process.exit(code);
}
for (const sig of ["SIGINT", "SIGTERM", "SIGHUP"] as const) process.on(sig, () => void shutdown(0));

if (mode === "up") {
  await provision(env, { log: say });
  say("database left running; `npm run db:stop` stops it");
  process.exit(0);
}

try {
  await provision(env, { log: say });
  if (env.MAIL_FAKE_URL) {
    const { startFakeMail, fakeMailPorts } = await import("@/lib/mail/fake-server");
    mail = await startFakeMail(fakeMailPorts(env.SMTP_URL, env.MAIL_FAKE_URL, env.MAIL_FAKE_SECRET!));
    say(`mail fake: SMTP on 127.0.0.1:${mail.smtpPort}, messages at ${env.MAIL_FAKE_URL}/messages`);
  }
  if (mode === "serve") {
    say("building (next build)…");
    await runStep(process.execPath, [nextBin, "build"]);
  }
  // server.mjs wraps Next so the app sees the socket's address (lib/http/client-address.ts).
  web = spawn(process.execPath, ["server.mjs", ...(mode === "dev" ? ["--dev"] : [])], {
    stdio: "inherit",
    env: { ...process.env, HOST: "127.0.0.1", PORT: String(env.PORT) },
  });
  web.on("exit", (code) => void shutdown(code ?? 0));
  say(`Forkwall is starting at ${env.APP_URL} (Ctrl-C stops it and the database)`);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  await shutdown(1);
}
