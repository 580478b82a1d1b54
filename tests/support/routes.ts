import { env } from "@/lib/env";

/** A Next.js route handler as the tests call it: a Request and the route's params. */
export type Handler<P> = (req: Request, ctx: { params: Promise<P> }) => Promise<Response>;

export type SendOptions = {
  method?: string;
  body?: unknown;
  /** Appended to the request path, e.g. "?tiles=B5". */
  query?: string;
  /** Sent as a machine does (Authorization: Bearer, no Origin) instead of a browser session. */
  bearer?: string;
  contentType?: string;
  path?: string;
};

/**
 * Calls a route handler as a same-origin browser would (the Origin header the CSRF check wants),
 * or with `bearer` as a machine does; only the query string of the path is read by handlers.
 */
export function request(handler: Handler<never>, params: object, opts: SendOptions = {}): Promise<Response> {
  const headers: Record<string, string> = opts.bearer
    ? { authorization: `Bearer ${opts.bearer}` }
    : { origin: new URL(env.APP_URL).origin };
  if (opts.body !== undefined) headers["content-type"] = opts.contentType ?? "application/json";
  return handler(
    new Request(`${env.APP_URL}${opts.path ?? "/api/v1/x"}${opts.query ?? ""}`, {
      method: opts.method ?? "GET",
      headers,
      ...(opts.body === undefined ? {} : { body: JSON.stringify(opts.body) }),
    }),
    { params: Promise.resolve(params) as Promise<never> },
  );
}

export function call<P>(handler: Handler<P>, params: P, method: string, body?: unknown, query = "") {
  return request(handler as Handler<never>, params as object, { method, body, query });
}

/** The error body every refused request carries. */
export type ErrorAnswer = {
  error: { code: string; message: string; issues?: { path: (string | number)[]; message: string }[] };
};

/** Like `request`, with the JSON answer read as `T` (an operation's result, or an ErrorAnswer). */
export async function send<T = Answer>(handler: Handler<never>, params: object, opts: SendOptions = {}) {
  const res = await request(handler, params, opts);
  return { status: res.status, headers: res.headers, json: (await res.json()) as T };
}

/** A JSON answer as most tests read it: an operation's result, or the error body of a refusal. */
export type Answer = Record<string, unknown> & {
  id?: number;
  error: { code: string; message: string; issues: { path: (string | number)[]; message: string }[] };
};

/** `call`, with the status and the JSON answer read as `T`. */
export async function callJson<P, T = Answer>(handler: Handler<P>, params: P, method: string, body?: unknown) {
  const res = await call(handler, params, method, body);
  return { status: res.status, json: (await res.json()) as T };
}

/** The paths of a 400's issues, joined with dots: what a test expects the refusal to name. */
export const issuePaths = (answer: ErrorAnswer) => (answer.error.issues ?? []).map((i) => i.path.join("."));
