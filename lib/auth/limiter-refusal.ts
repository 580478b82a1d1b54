/**
 * True when rate-limiter-flexible refused a point. Checked by shape, not by `instanceof
 * RateLimiterRes`: a limiter kept in globalThis may come from another bundled copy of the package.
 */
export function isLimiterRefusal(err: unknown): err is { msBeforeNext: number; remainingPoints: number } {
  if (typeof err !== "object" || err === null || err instanceof Error) return false;
  const { msBeforeNext, remainingPoints } = err as { msBeforeNext?: unknown; remainingPoints?: unknown };
  return typeof msBeforeNext === "number" && typeof remainingPoints === "number";
}
