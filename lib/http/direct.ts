import "server-only";
import { gzipSync } from "node:zlib";
import { checkPageReply, hasSessionCookie, shortCodeReply, type Reply } from "./check-page";

// The answers server.mjs gives without Next: anonymous scans of /v/<token> and typed /c/<code>.
// A scan passing through Next's request pipeline costs several times the page's own work
// (README "Speed"); these two public routes need none of it (no session, no proxy, no React).
// A request with a session cookie, or any other path, answers null and Next serves it. Both
// paths run the same functions (lib/http/check-page.ts); the route handlers are the fallback.

export type DirectReply = { status: number; headers: Record<string, string>; body: Buffer | null };

const ROUTE = /^\/([vc])\/([^/?#]+)(?:\?.*)?$/;

function encode(reply: Reply, acceptsGzip: boolean): DirectReply {
  if (reply.body === null) return { status: reply.status, headers: reply.headers, body: null };
  // Next compresses its answers the same way (gzip when asked); small bodies are not worth it.
  if (acceptsGzip && reply.body.length > 1024) {
    const gzip = reply.memo?.gzip ?? gzipSync(reply.body);
    if (reply.memo) reply.memo.gzip = gzip;
    return {
      status: reply.status,
      headers: { ...reply.headers, "content-encoding": "gzip", vary: "Accept-Encoding" },
      body: gzip,
    };
  }
  return {
    status: reply.status,
    headers: { ...reply.headers, vary: "Accept-Encoding" },
    body: Buffer.from(reply.body),
  };
}

/** The direct answer to a GET or HEAD of `url` (path and query), or null for Next to serve. */
export async function directReply(method: string, url: string, headers: Headers): Promise<DirectReply | null> {
  if (method !== "GET" && method !== "HEAD") return null;
  const m = ROUTE.exec(url);
  if (!m) return null;
  let param: string;
  try {
    param = decodeURIComponent(m[2]!);
  } catch {
    return null;
  }
  const acceptsGzip = /\bgzip\b/.test(headers.get("accept-encoding") ?? "");
  if (m[1] === "c") return encode(await shortCodeReply(headers, param), acceptsGzip);
  if (hasSessionCookie(headers)) return null;
  return encode(await checkPageReply(headers, param), acceptsGzip);
}

const KEY = Symbol.for("forkwall.directReply");

/** Called once per server process (instrumentation.ts); server.mjs looks the handler up under this key. */
export function registerDirectRoutes() {
  (globalThis as Record<symbol, unknown>)[KEY] = directReply;
}
