// Next runs register() once when a server process starts: the stale-copy digest timer starts
// here (Node.js runtime only; the edge runtime has no database).
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startNoticeTimer } = await import("@/lib/ops/notice-timer");
  startNoticeTimer();
}
