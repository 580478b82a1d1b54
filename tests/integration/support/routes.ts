import { env } from "@/lib/env";

/** A Next.js route handler as the tests call it: a Request and the route's params. */
export type Handler<P> = (req: Request, ctx: { params: Promise<P> }) => Promise<Response>;

/**
 * Calls a route handler as a same-origin browser would (the Origin header the CSRF check wants),
 * with an optional JSON body and query string; the path itself is not routed, only `query` is read.
 */
export async function call<P>(handler: Handler<P>, params: P, method: string, body?: unknown, query = "") {
  const headers: Record<string, string> = { origin: new URL(env.APP_URL).origin };
  if (body !== undefined) headers["content-type"] = "application/json";
  return handler(
    new Request(`${env.APP_URL}/api/v1/x${query}`, {
      method,
      headers,
      ...(body === undefined ? {} : { body: JSON.stringify(body) }),
    }),
    { params: Promise.resolve(params) },
  );
}
