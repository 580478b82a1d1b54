// `npm run lab:create -- --name "North Cath Lab" --slug north-cath-lab --manager lead@hospital.example`
// For self-hosted installs: creates an empty lab and e-mails its first manager an invitation
// (the same invitation the Members page sends). Exit 0 on success, 1 when refused, 2 on usage.
import { parseArgs } from "node:util";
import { loadLocalEnv } from "./local-env";

const USAGE = 'usage: npm run lab:create -- --name "Lab name" --slug lab-slug --manager manager@hospital.example';

let values: { name?: string; slug?: string; manager?: string; help?: boolean };
try {
  ({ values } = parseArgs({
    options: {
      name: { type: "string" },
      slug: { type: "string" },
      manager: { type: "string" },
      help: { type: "boolean", short: "h" },
    },
    strict: true,
  }));
} catch (err) {
  console.error(`${err instanceof Error ? err.message : String(err)}\n${USAGE}`);
  process.exit(2);
}
if (values.help) {
  console.log(USAGE);
  process.exit(0);
}
const missing = (["name", "slug", "manager"] as const).filter((k) => values[k] === undefined);
if (missing.length) {
  console.error(`missing ${missing.map((k) => `--${k}`).join(", ")}\n${USAGE}`);
  process.exit(2);
}

loadLocalEnv();
const { env } = await import("@/lib/env");
const local = await import("./local-server");
const { createLabByOperator } = await import("@/lib/ops/lab-create");
const { toAppError } = await import("@/lib/errors");
const { pool } = await import("./index");

const say = (msg: string) => console.log(`\x1b[36m[forkwall]\x1b[0m ${msg}`);
let code = 0;
let startedHere = false;
const server = local.localServer({ port: env.DB_PORT });
try {
  if (!process.env.DATABASE_URL) startedHere = (await local.start(server)) === "started";
  const res = await createLabByOperator({ name: values.name!, slug: values.slug!, manager: values.manager! });
  say(`lab "${res.lab.name}" created at ${env.APP_URL}/labs/${res.lab.slug}`);
  if (res.emailSent)
    say(
      `invitation to manage it e-mailed to ${res.invitation.email} (valid until ${res.invitation.expiresAt.toISOString()})`,
    );
  else {
    say(`the invitation e-mail to ${res.invitation.email} could not be sent (is SMTP_URL reachable?).`);
    say(`hand this single-use link to them yourself, valid until ${res.invitation.expiresAt.toISOString()}:`);
    console.log(res.link);
  }
} catch (err) {
  const known = toAppError(err);
  console.error(`refused: ${known.message}`);
  for (const issue of known.issues ?? []) console.error(`  --${issue.path.join(".")}: ${issue.message}`);
  if (known.code === "internal") console.error(err);
  code = 1;
} finally {
  await pool.end().catch(() => {});
  if (startedHere) await local.stop(server);
}
process.exit(code);
