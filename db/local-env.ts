// Local secrets live in .env.local (git-ignored), generated on first run; values already in
// the process environment win, as they do in Next.js.
import { randomBytes } from "node:crypto";
import { appendFileSync, existsSync, readFileSync, writeFileSync } from "node:fs";
import { parseEnv } from "node:util";

const FILE = ".env.local";

const secret = (bytes: number) => randomBytes(bytes).toString("base64url");

export function loadLocalEnv(): void {
  if (!existsSync(FILE)) {
    writeFileSync(
      FILE,
      [
        "# Generated on first run by `npm start` / `npm test`; not committed. See .env.example.",
        `AUTH_SECRET=${secret(32)}`,
        `DB_PASSWORD=${secret(18)}`,
        `MAIL_FAKE_SECRET=${secret(24)}`,
        "SMTP_URL=smtp://127.0.0.1:2525",
        "MAIL_FAKE_URL=http://127.0.0.1:2580",
        "",
      ].join("\n"),
      { mode: 0o600 },
    );
  }
  let values = parseEnv(readFileSync(FILE, "utf8")) as Record<string, string>;
  // Files written before the mail fake asked for a secret get one.
  if (values.MAIL_FAKE_URL && !values.MAIL_FAKE_SECRET) {
    appendFileSync(FILE, `MAIL_FAKE_SECRET=${secret(24)}\n`);
    values = parseEnv(readFileSync(FILE, "utf8")) as Record<string, string>;
  }
  for (const [key, value] of Object.entries(values)) {
    if (process.env[key] === undefined) process.env[key] = value;
  }
}
