import "server-only";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import { deliverDueDigests } from "./notices";

const globalForTimer = globalThis as unknown as { forkwallNoticeTimer?: NodeJS.Timeout };

/** How often the timer looks for digests whose quiet period has passed: half the period, 0.5 to 60 s. */
export const tickMs = (quietSeconds: number) => Math.min(60_000, Math.max(500, (quietSeconds * 1000) / 2));

/**
 * Wakes every tick and mails the digests that came due, so a lab's last change is reported after
 * the quiet period even when nothing else is written. Every instance runs one; the claim in
 * deliverDigest makes sure only one of them sends each digest. Started once per process from
 * instrumentation.ts.
 */
export function startNoticeTimer(): void {
  if (globalForTimer.forkwallNoticeTimer) return;
  let running = false;
  const timer = setInterval(() => {
    if (running) return;
    running = true;
    deliverDueDigests()
      .catch((err: unknown) => log.warn({ err }, "stale-copy digests not checked; will retry"))
      .finally(() => (running = false));
  }, tickMs(env.STALE_MAIL_QUIET_SECONDS));
  timer.unref();
  globalForTimer.forkwallNoticeTimer = timer;
}
