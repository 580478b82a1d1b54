// Next runs register() once when a server process starts, before it serves a request: the
// environment is checked (a bad one stops the process), the stale-copy digest timer starts, and
// the check page's direct path is handed to server.mjs (lib/http/direct.ts). Node.js runtime only.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { exitOnInvalidEnvironment } = await import("@/lib/startup-env");
  exitOnInvalidEnvironment();
  const { startNoticeTimer } = await import("@/lib/ops/notice-timer");
  startNoticeTimer();
  const { registerDirectRoutes } = await import("@/lib/http/direct");
  registerDirectRoutes();
}
