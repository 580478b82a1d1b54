// How sign-in failures are answered: free at first, then slowed, then refused until the
// window has passed.

/** Delay before checking a password, from the failures already counted for a key. */
export function signInDelayMs(fails: number, maxFails: number): number {
  const slowFrom = Math.max(1, Math.floor(maxFails / 2));
  if (fails < slowFrom) return 0;
  return Math.min(250 * 2 ** (fails - slowFrom), 2000);
}

export function isRefused(fails: number, maxFails: number): boolean {
  return fails >= maxFails;
}

/** The client address: the right-most X-Forwarded-For entry is the one our own proxy (or Next) saw. */
export function clientAddress(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for");
  const last = forwarded
    ?.split(",")
    .map((s) => s.trim())
    .filter(Boolean)
    .pop();
  const ip = last ?? headers.get("x-real-ip") ?? "unknown";
  return ip.replace(/^::ffff:/, "").slice(0, 64);
}

export function throttledMessage(windowSeconds: number): string {
  const minutes = Math.max(1, Math.ceil(windowSeconds / 60));
  return `Too many failed attempts. Sign-in is paused for up to ${minutes} minute${minutes === 1 ? "" : "s"}; try again later or reset your password.`;
}
