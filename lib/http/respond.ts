import "server-only";
import { type AppError, errorBody, isAppError, toAppError as asAppError } from "@/lib/errors";
import { log, type Logger } from "@/lib/log";

/** The error as the app's own type (an outage becomes "unavailable"), or null for an unexpected one. */
export function toAppError(err: unknown): AppError | null {
  const known = asAppError(err);
  return known.code === "internal" && !isAppError(err) ? null : known;
}

/** Turns any error into the JSON answer; the one place where failures are logged. */
export function errorResponse(err: unknown, context: Record<string, unknown> = {}, logger: Logger = log): Response {
  const known = toAppError(err) ?? asAppError(err);
  if (known.code === "unavailable") logger.warn({ err, ...context }, "database unreachable");
  else if (known !== err) logger.error({ err, ...context }, "unexpected error");
  else if (known.status >= 500) logger.warn({ err, ...context }, known.message);
  else logger.debug({ code: known.code, status: known.status, ...context }, known.message);
  const retry = (known as { retryAfterSeconds?: unknown }).retryAfterSeconds;
  const challenge = (known as { wwwAuthenticate?: unknown }).wwwAuthenticate;
  const headers: Record<string, string> =
    known.status === 503
      ? { "cache-control": "no-store", "retry-after": "30" }
      : typeof retry === "number"
        ? { "retry-after": String(retry) }
        : {};
  if (typeof challenge === "string") headers["www-authenticate"] = challenge;
  return Response.json(errorBody(known), { status: known.status, headers });
}
