// The web server: Next's request handler behind a plain Node HTTP server, so the app can know
// the TCP peer's address. Next itself only copies the socket address into X-Forwarded-For
// when the client did not send one, so that header alone cannot be trusted. Here any
// client-sent x-forkwall-peer is replaced by the socket's address before Next sees the request
// (lib/http/client-address.ts reads it). Usage: node server.mjs [--dev]; binds 127.0.0.1:PORT.
import { createServer } from "node:http";

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

const server = createServer((req, res) => {
  if (!METHODS.includes(req.method ?? "")) {
    res.writeHead(405, { allow: METHODS.join(", "), "content-type": "application/json" });
    res.end(JSON.stringify({ error: { code: "method_not_allowed", message: `${req.method} is not supported.` } }));
    return;
  }
  req.headers[PEER_HEADER] = req.socket.remoteAddress ?? "";
  void handle(req, res);
});
server.listen(port, hostname, () => console.log(`> Forkwall on http://${hostname}:${port}${dev ? " (dev)" : ""}`));
for (const sig of ["SIGINT", "SIGTERM"]) {
  process.on(sig, () => {
    server.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 5000).unref();
  });
}
