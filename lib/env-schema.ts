import { z } from "zod";
import { isLoopbackUrl } from "./net/loopback";

const port = z.coerce.number().int().min(1).max(65535);

const schema = z
  .object({
    NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
    PORT: port.default(3000),
    APP_URL: z.url().optional(),
    DB_HOST: z.string().default("127.0.0.1"),
    DB_PORT: port.default(3307),
    DB_NAME: z
      .string()
      .regex(/^[a-z][a-z0-9_]{0,62}$/, "lower-case letters, digits and _ only")
      .default("forkwall"),
    DB_USER: z.string().default("forkwall"),
    DB_PASSWORD: z.string().default("forkwall-local"),
    DATABASE_URL: z.string().optional(),
    AUTH_SECRET: z.string().min(32).optional(),
    SMTP_URL: z.string().default("smtp://127.0.0.1:2525"),
    MAIL_FROM: z.string().default("Forkwall <no-reply@forkwall.test>"),
    MAIL_FAKE_URL: z.url().optional(),
    // Asked of every caller of the mail fake's HTTP interface (Authorization: Bearer ...).
    MAIL_FAKE_SECRET: z.string().min(16).optional(),
    // How many reverse-proxy hops in front of the app to believe in X-Forwarded-For (0: none,
    // the socket's address is the client's).
    TRUST_PROXY: z.coerce.number().int().min(0).max(10).default(0),
    // Sign-in throttle: failures allowed per account and per client address inside one window.
    SIGNIN_MAX_FAILS_PER_ACCOUNT: z.coerce.number().int().min(1).max(1000).default(5),
    SIGNIN_MAX_FAILS_PER_IP: z.coerce.number().int().min(1).max(100000).default(30),
    SIGNIN_THROTTLE_SECONDS: z.coerce.number().int().min(1).max(86400).default(900),
    // Attempts after the first when a write transaction loses a deadlock or a Galera
    // certification conflict (errors 1213/1205); 0 turns retrying off.
    WRITE_RETRIES: z.coerce.number().int().min(0).max(20).default(5),
    // Requests a minute each client address may make to each public endpoint (solve, check).
    PUBLIC_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).max(1_000_000).default(120),
    // Requests a minute each machine token may make (Authorization: Bearer); then 429.
    TOKEN_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).max(1_000_000).default(120),
    // Stale-copy mail waits until a lab has had no new stale copies for this long, then goes out
    // as one digest (lib/ops/notices.ts); 0 sends after every change.
    STALE_MAIL_QUIET_SECONDS: z.coerce.number().int().min(0).max(86_400).default(600),
    // Who may create an account: "open" (anyone, through /sign-up and POST /api/v1/accounts) or
    // "invite-only" (only invitations create accounts). Unset: open on a loopback APP_URL
    // (development, tests, a local `npm start`), invite-only on a public address.
    SIGNUP: z.enum(["open", "invite-only"], { error: 'SIGNUP must be "open" or "invite-only"' }).optional(),
    LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  })
  .transform((e) => {
    const APP_URL = (e.APP_URL ?? `http://localhost:${e.PORT}`).replace(/\/+$/, "");
    return {
      ...e,
      APP_URL,
      SIGNUP: e.SIGNUP ?? (isLoopbackUrl(APP_URL) ? "open" : "invite-only"),
      DATABASE_URL:
        e.DATABASE_URL ??
        `mysql://${encodeURIComponent(e.DB_USER)}:${encodeURIComponent(e.DB_PASSWORD)}@${e.DB_HOST}:${e.DB_PORT}/${e.DB_NAME}`,
    };
  })
  .superRefine((e, ctx) => {
    if (!e.MAIL_FAKE_URL) return;
    // The fake's mail (invitations, password-reset links) is readable at /dev/mail: only on a
    // machine whose users are the people who own it.
    if (!isLoopbackUrl(e.APP_URL))
      ctx.addIssue({
        code: "custom",
        path: ["MAIL_FAKE_URL"],
        message: `the local mail fake is for a loopback APP_URL only (APP_URL is ${e.APP_URL}); unset MAIL_FAKE_URL and point SMTP_URL at a real relay`,
      });
    if (!isLoopbackUrl(e.MAIL_FAKE_URL))
      ctx.addIssue({
        code: "custom",
        path: ["MAIL_FAKE_URL"],
        message: "the mail fake must listen on a loopback address",
      });
    if (!e.MAIL_FAKE_SECRET)
      ctx.addIssue({
        code: "custom",
        path: ["MAIL_FAKE_SECRET"],
        message: "required with MAIL_FAKE_URL (npm start writes one into .env.local)",
      });
  });

export type Env = z.infer<typeof schema>;

/** Validates an environment (exported for tests; the app uses `env`). */
export function parseEnv(source: Record<string, string | undefined>) {
  return schema.safeParse(source);
}
