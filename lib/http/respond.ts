import "server-only";
import { AppError, errorBody, isDatabaseUnavailable, OUTAGE_MESSAGE } from "@/lib/errors";
import { logger } from "@/lib/log";

/** The error as the app's own type, or null for an unexpected one. */
export function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (isDatabaseUnavailable(err)) return new AppError("unavailable", OUTAGE_MESSAGE);
  return null;
}

/** Turns any error into the JSON answer; the one place where failures are logged. */
export function errorResponse(err: unknown, context: Record<string, unknown> = {}): Response {
  const known = toAppError(err);
  if (known) {
    if (known.status >= 500) logger.error({ err, ...context }, known.message);
    const headers: Record<string, string> =
      known.status === 503 ? { "cache-control": "no-store", "retry-after": "30" } : {};
    return Response.json(errorBody(known), { status: known.status, headers });
  }
  logger.error({ err, ...context }, "unexpected error");
  return Response.json(
    { error: { code: "internal", message: "Something went wrong on our side. Please try again." } },
    { status: 500 },
  );
}
