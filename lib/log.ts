// The app's one logger: JSON lines on stdout (pino), level from LOG_LEVEL. Nothing secret is
// written: known secret fields are censored wherever they sit, and errors are serialised without
// the bound values of a failed query (they can hold password hashes and token hashes).
import pino, { type DestinationStream, type Logger } from "pino";
import { env } from "@/lib/env";

export type { Logger };

const SECRET_KEYS = [
  "password",
  "newPassword",
  "currentPassword",
  "passwordHash",
  "token",
  "tokenHash",
  "secret",
  "cookie",
  "authorization",
  "set-cookie",
  "AUTH_SECRET",
  "DB_PASSWORD",
  "DATABASE_URL",
  "SMTP_URL",
];

/** Censored at the top level, one level down and in request/response headers. */
export const REDACT_PATHS = [
  ...SECRET_KEYS.map((k) => `["${k}"]`),
  ...SECRET_KEYS.map((k) => `*["${k}"]`),
  ...["req", "res", "request", "response"].flatMap((r) => SECRET_KEYS.map((k) => `${r}.headers["${k}"]`)),
];

type SerialisedError = {
  type: string;
  message: string;
  stack?: string;
  code?: unknown;
  errno?: unknown;
  sqlState?: unknown;
  cause?: SerialisedError | string;
};

/** Error -> plain object, following `.cause`; query text is kept, bound values are not. */
export function serialiseError(err: unknown, depth = 0): SerialisedError | string {
  if (!(err instanceof Error)) return typeof err === "string" ? err : String(err);
  const e = err as Error & { code?: unknown; errno?: unknown; sqlState?: unknown; query?: unknown };
  // drizzle's query errors put the parameters into the message: keep only the statement.
  const message = typeof e.query === "string" ? `Failed query: ${e.query}` : e.message.split("\nparams:")[0]!;
  const out: SerialisedError = { type: e.name, message };
  if (e.stack) out.stack = e.stack.replace(e.message, message);
  if (e.code !== undefined) out.code = e.code;
  if (e.errno !== undefined) out.errno = e.errno;
  if (e.sqlState !== undefined) out.sqlState = e.sqlState;
  if (e.cause !== undefined && depth < 5) out.cause = serialiseError(e.cause, depth + 1);
  return out;
}

export function createLogger(opts: { level?: string; destination?: DestinationStream } = {}): Logger {
  return pino(
    {
      level: opts.level ?? env.LOG_LEVEL,
      base: { app: "forkwall" },
      redact: { paths: REDACT_PATHS, censor: "[redacted]" },
      serializers: { err: serialiseError, error: serialiseError },
      timestamp: pino.stdTimeFunctions.isoTime,
    },
    opts.destination,
  );
}

export const log: Logger = createLogger();

export type LogContext = {
  requestId?: string;
  userId?: number | string | null;
  /** A machine token's row id (never the token itself). */
  tokenId?: number | null;
  labId?: number | null;
  operation?: string;
  durationMs?: number;
};

/** A child logger carrying who did what where; undefined fields are left out. */
export function logFor(ctx: LogContext, parent: Logger = log): Logger {
  const bindings = Object.fromEntries(Object.entries(ctx).filter(([, v]) => v !== undefined && v !== null));
  return parent.child(bindings);
}
