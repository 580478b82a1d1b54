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

export function throttledMessage(windowSeconds: number): string {
  const minutes = Math.max(1, Math.ceil(windowSeconds / 60));
  return `Too many failed attempts. Sign-in is paused for up to ${minutes} minute${minutes === 1 ? "" : "s"}; try again later or reset your password.`;
}
