// The one error type of the app: a code, an HTTP status, a message a person can act on, and
// optional per-field issues. Route handlers turn it into JSON through errorResponse().
export type ErrorCode =
  | "invalid_input"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
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
  no_solution: 422,
  unprocessable: 422,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
};

export type FieldIssue = { path: (string | number)[]; message: string };

export class AppError extends Error {
  readonly status: number;
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

export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const retry = (err as { retryAfterSeconds?: unknown }).retryAfterSeconds;
    const headers = typeof retry === "number" ? { "retry-after": String(retry) } : undefined;
    return Response.json(errorBody(err), { status: err.status, headers });
  }
  console.error(err);
  return Response.json(
    { error: { code: "internal", message: "Something went wrong on our side. Please try again." } },
    { status: 500 },
  );
}
