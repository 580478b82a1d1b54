// Next runs register() once when a server process starts, before it serves a request: the
// stale-copy digest timer starts here, and the check page's direct path is handed to server.mjs
// (lib/http/direct.ts). Node.js runtime only; the edge runtime has no database.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startNoticeTimer } = await import("@/lib/ops/notice-timer");
  startNoticeTimer();
  const { registerDirectRoutes } = await import("@/lib/http/direct");
  registerDirectRoutes();
}
