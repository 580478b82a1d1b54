// The web server: Next's request handler behind a plain Node HTTP server, so the app can know
// the TCP peer's address. Next itself only copies the socket address into X-Forwarded-For
// when the client did not send one, so that header alone cannot be trusted. Here any
// client-sent x-forkwall-peer is replaced by the socket's address before Next sees the request
// (lib/http/client-address.ts reads it). Anonymous scans of /v/<token> and /c/<code> are
// answered here by the app's own handler, which instrumentation.ts registers while Next
// prepares (lib/http/direct.ts), with the headers Next would send; everything else, and those
// two whenever the handler declines or fails, goes to Next. Usage: node server.mjs [--dev];
// binds 127.0.0.1:PORT.
import { createServer } from "node:http";
import { securityHeaders } from "./lib/http/security-headers.mjs";

const dev = process.argv.includes("--dev");
if (!dev) process.env.NODE_ENV = "production";
const { default: next } = await import("next");

const PEER_HEADER = "x-forkwall-peer";
const hostname = process.env.HOST || "127.0.0.1";
const port = Number(process.env.PORT || 3000);
const app = next({ dev, hostname, port, dir: import.meta.dirname });
const handle = app.getRequestHandler();
await app.prepare();

// Methods the app answers; anything else (TRACE reflects requests back, TRACK, WebDAV verbs)
// is refused here with 405, before Next, which answers TRACE on route handlers with a 500.
const METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"];

const DIRECT = Symbol.for("forkwall.directReply");
const SECURITY = Object.fromEntries(securityHeaders(dev).map((h) => [h.key.toLowerCase(), h.value]));

function decodablePath(url) {
  try {
    decodeURIComponent(url.split("?")[0]);
    return true;
  } catch {
    return false;
  }
}

/** Answers the request directly when the app's handler takes it; false when Next should. */
async function direct(req, res) {
  const reply = globalThis[DIRECT];
  if (typeof reply !== "function" || !/^\/[vc]\//.test(req.url ?? "")) return false;
  const headers = new Headers();
  for (const [name, value] of Object.entries(req.headers))
    if (value !== undefined) headers.set(name, Array.isArray(value) ? value.join(", ") : value);
  let answer;
  try {
    answer = await reply(req.method, req.url, headers);
  } catch (err) {
    // Next's route handler runs the same code and reports the error its own way.
    console.error("direct check-page path failed; Next answers instead:", err);
    return false;
  }
  if (!answer) return false;
  res.writeHead(answer.status, { ...SECURITY, ...answer.headers, "content-length": answer.body?.length ?? 0 });
  res.end(req.method === "HEAD" ? undefined : (answer.body ?? undefined));
  return true;
}

const server = createServer((req, res) => {
  if (!METHODS.includes(req.method ?? "")) {
    res.writeHead(405, { allow: METHODS.join(", "), "content-type": "application/json" });
    res.end(JSON.stringify({ error: { code: "method_not_allowed", message: `${req.method} is not supported.` } }));
    return;
  }
  if (!decodablePath(req.url ?? "/")) {
    // Next would fail on it with a 500 and without the security headers.
    res.writeHead(400, { ...SECURITY, "content-type": "application/json" });
    res.end(JSON.stringify({ error: { code: "invalid_input", message: "The address has broken %-escapes." } }));
    return;
  }
  req.headers[PEER_HEADER] = req.socket.remoteAddress ?? "";
  direct(req, res).then(
    (done) => done || handle(req, res),
    () => handle(req, res),
  );
});
server.listen(port, hostname, () => console.log(`> Forkwall on http://${hostname}:${port}${dev ? " (dev)" : ""}`));
for (const sig of ["SIGINT", "SIGTERM"]) {
  process.on(sig, () => {
    server.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 5000).unref();
  });
}
