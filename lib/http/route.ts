import "server-only";
import { randomUUID } from "node:crypto";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { machineRefused } from "@/lib/ops/access";
import { annotateLog, requestLog, withLogContext } from "@/lib/request-log";
import { checkWriteRequest, mediaType } from "./origin";
import { errorResponse } from "./respond";
import { isBrowserNavigation, signInRedirectFor } from "./sign-in-redirect";
import { ANONYMOUS, sessionCaller, type Caller } from "@/lib/ops/caller";
import { hasBearer, tokenCaller } from "@/lib/auth/machine-auth";

/** Everything a route handler needs from its request, read only when asked for. */
export type RouteInput<P> = {
  req: Request;
  params: P;
  caller: Caller;
  /** The JSON body; with `optional`, an empty body reads as {}. */
  body: (opts?: { optional?: boolean }) => Promise<unknown>;
  /** The query string as a plain object (each key once). */
  query: () => Record<string, string>;
};

const MAX_JSON_BYTES = 256 * 1024;

export async function readJson(req: Request, opts: { optional?: boolean } = {}): Promise<unknown> {
  const text = await req.text();
  if (opts.optional && text.trim() === "") return {};
  const type = req.headers.get("content-type") ?? "";
  if (mediaType(type) !== "application/json")
    throw new AppError("unsupported_media_type", "Send the body as JSON with Content-Type: application/json.");
  if (text.length > MAX_JSON_BYTES) throw new AppError("payload_too_large", "The JSON body is larger than 256 KB.");
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("invalid_input", "The body is not valid JSON.");
  }
}

/**
 * Who calls: a Bearer request is a machine token (never the session, even with a cookie: it
 * skipped the browser-origin check); otherwise the session. Public routes never read the session:
 * they answer the same to everyone, and machine tokens are for the stock routes only.
 */
async function callerOf(req: Request, opts: { public?: boolean }): Promise<Caller> {
  if (hasBearer(req)) {
    const caller = await tokenCaller(req);
    if (caller.kind === "token") annotateLog({ tokenId: caller.token.id, labId: caller.token.labId });
    if (opts.public) throw machineRefused();
    return caller;
  }
  return opts.public ? ANONYMOUS : sessionCaller();
}

/**
 * The one route-handler wrapper: builds the caller from the session, runs the handler (which
 * calls one operation), answers its result as JSON (or passes a Response through), and turns any
 * error into `{"error":{...}}` with its status, logged once.
 */
export function api<P = Record<string, string>>(
  fn: (input: RouteInput<P>) => Promise<unknown>,
  opts: { status?: number; public?: boolean } = {},
) {
  return async (req: Request, ctx: { params: Promise<P> }): Promise<Response> => {
    const started = performance.now();
    const logCtx = { requestId: randomUUID(), operation: `${req.method} ${new URL(req.url).pathname}` };
    return withLogContext(logCtx, async () => {
      let res: Response;
      try {
        // A state-changing request from another site's page is refused before anything else.
        const write = checkWriteRequest(req, env.APP_URL);
        if (!write.ok) throw new AppError(write.status === 415 ? "unsupported_media_type" : "forbidden", write.message);
        const params = await ctx.params;
        const result = await fn({
          req,
          params,
          caller: await callerOf(req, opts),
          body: (o) => readJson(req, o),
          query: () => Object.fromEntries(new URL(req.url).searchParams),
        });
        res = result instanceof Response ? result : Response.json(result, { status: opts.status ?? 200 });
      } catch (err) {
        res = errorResponse(err, {}, requestLog());
      }
      if (res.status === 401 && req.method === "GET" && isBrowserNavigation(req.headers))
        res = new Response(null, { status: 303, headers: { location: signInRedirectFor(req.url) } });
      requestLog({ durationMs: Math.round(performance.now() - started) }).info({ status: res.status }, "request");
      return res;
    });
  };
}
