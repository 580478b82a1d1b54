import "server-only";
import { AsyncLocalStorage } from "node:async_hooks";
import { logFor, type LogContext, type Logger } from "@/lib/log";

// The context of the request being served, so code deep in a call (the guard that learns the
// user and lab) can add to what the request's log lines carry.
const requestContext = new AsyncLocalStorage<LogContext>();

export function withLogContext<T>(ctx: LogContext, fn: () => Promise<T>): Promise<T> {
  return requestContext.run(ctx, fn);
}

/** Adds fields (user id, lab id) to the current request's context; a no-op outside a request. */
export function annotateLog(fields: LogContext): void {
  const ctx = requestContext.getStore();
  if (ctx) Object.assign(ctx, fields);
}

/** A logger for the current request (or the root logger outside one). */
export function requestLog(extra: LogContext = {}): Logger {
  return logFor({ ...requestContext.getStore(), ...extra });
}
