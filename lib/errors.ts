// The one error type of the app: a code, an HTTP status, a message a person can act on, and
// optional per-field issues. lib/http/respond.ts turns it into JSON (and logs, once).

export type ErrorCode =
  | "invalid_input"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "unsupported_media_type"
  | "no_solution"
  | "unprocessable"
  | "rate_limited"
  | "unavailable"
  | "internal";

const STATUS: Record<ErrorCode, number> = {
  invalid_input: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  no_solution: 422,
  unprocessable: 422,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
};

export type FieldIssue = { path: (string | number)[]; message: string };

// A registry symbol, so an error made by another loaded copy of this module is still recognised.
const BRAND = Symbol.for("forkwall.app-error");

export class AppError extends Error {
  readonly status: number;
  readonly [BRAND] = true;
  /** Seconds a client should wait, for "rate_limited" answers (sent as Retry-After). */
  retryAfterSeconds?: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly issues?: FieldIssue[],
  ) {
    super(message);
    this.name = "AppError";
    this.status = STATUS[code];
  }
}

/** True for an AppError from any loaded copy of this module (class identity is not relied on). */
export function isAppError(err: unknown): err is AppError {
  if (typeof err !== "object" || err === null || (err as Record<symbol, unknown>)[BRAND] !== true) return false;
  const { code, status } = err as { code?: unknown; status?: unknown };
  return typeof code === "string" && code in STATUS && status === STATUS[code as ErrorCode];
}

/** A 429 that tells the client when to come back. */
export function rateLimited(message: string, retryAfterSeconds: number): AppError {
  const err = new AppError("rate_limited", message);
  err.retryAfterSeconds = Math.max(1, Math.ceil(retryAfterSeconds));
  return err;
}

export const unauthenticated = () => new AppError("unauthenticated", "Sign in to continue.");
export const forbidden = (what = "do this") =>
  new AppError("forbidden", `Your role in this lab does not allow you to ${what}.`);
export const notFound = (what = "That") => new AppError("not_found", `${what} was not found.`);

/** zod-style issues -> a 400 that names each field and why. */
export function invalidInput(issues: { path: readonly PropertyKey[]; message: string }[], message?: string): AppError {
  const list = issues.map((i) => ({
    path: i.path.map((p) => (typeof p === "number" ? p : String(p))),
    message: i.message,
  }));
  const describe = (i: FieldIssue) => `${i.path.length ? i.path.join(".") + ": " : ""}${i.message}`;
  const summary =
    message ??
    (list.length === 0
      ? "Invalid input."
      : list.length === 1
        ? describe(list[0]!)
        : `${list.length} problems; first, ${describe(list[0]!)}`);
  return new AppError("invalid_input", summary, list);
}

export function errorBody(err: AppError) {
  return { error: { code: err.code, message: err.message, ...(err.issues ? { issues: err.issues } : {}) } };
}

// Client-side codes (mysql2 and Node sockets) and server error numbers that mean "no database",
// as opposed to a query that the database refused.
const UNREACHABLE_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "ENOTFOUND",
  "EPIPE",
  "PROTOCOL_CONNECTION_LOST",
  "PROTOCOL_SEQUENCE_TIMEOUT",
  "ER_CON_COUNT_ERROR",
  "ER_SERVER_SHUTDOWN",
  "ER_CONNECTION_KILLED",
  "ER_CLIENT_INTERACTION_TIMEOUT",
]);
// 1040 too many connections, 1053 shutdown in progress, 1927 connection killed,
// 2002/2003 cannot connect, 2006 server gone away, 2013 lost connection during query.
// 1047 is a Galera node that has lost quorum: it refuses every query until it rejoins.
const UNREACHABLE_ERRNOS = new Set([1040, 1047, 1053, 1927, 2002, 2003, 2006, 2013]);

export const DATABASE_UNAVAILABLE_MESSAGE =
  "Forkwall cannot reach its database right now, so nothing could be checked or saved and nothing was changed. Please try again in a minute.";

/** True when `err`, or anything in its `.cause` chain, says the database cannot be reached. */
export function isDatabaseUnreachable(err: unknown): boolean {
  const seen = new Set<unknown>();
  let e: unknown = err;
  while (e && typeof e === "object" && !seen.has(e)) {
    seen.add(e);
    const { code, errno, fatal, message } = e as {
      code?: unknown;
      errno?: unknown;
      fatal?: unknown;
      message?: unknown;
    };
    if (isAppError(e)) return e.code === "unavailable";
    if (typeof code === "string" && UNREACHABLE_CODES.has(code)) return true;
    if (typeof errno === "number" && UNREACHABLE_ERRNOS.has(errno)) return true;
    // mysql2 marks errors that broke the connection itself as fatal.
    if (fatal === true) return true;
    if (typeof message === "string" && /closed state|Pool is closed/i.test(message)) return true;
    // AggregateError (several addresses tried) keeps its parts in `errors`.
    const parts = (e as { errors?: unknown }).errors;
    if (Array.isArray(parts) && parts.some((p) => isDatabaseUnreachable(p))) return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

/** Any thrown value -> the AppError a person sees: outages become "unavailable", the rest "internal". */
export function toAppError(err: unknown): AppError {
  if (isAppError(err)) return err;
  if (isDatabaseUnreachable(err)) return new AppError("unavailable", DATABASE_UNAVAILABLE_MESSAGE);
  return new AppError("internal", "Something went wrong on our side. Please try again.");
}
