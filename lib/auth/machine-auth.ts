import "server-only";
import { RateLimiterMySQL } from "rate-limiter-flexible";
import { isLimiterRefusal } from "@/lib/auth/limiter-refusal";
import { pool } from "@/db";
import { findActiveToken, touchToken } from "@/db/queries/tokens";
import { env } from "@/lib/env";
import { AppError, rateLimited } from "@/lib/errors";
import type { Caller } from "@/lib/ops/caller";
import { bearerToken, hashMachineToken, looksLikeMachineToken } from "./machine-tokens";
import { databaseName } from "./sign-in";

/** 401 for a Bearer credential that is not an active token, with the RFC 6750 challenge. */
export class BearerRefused extends AppError {
  readonly wwwAuthenticate = 'Bearer realm="forkwall", error="invalid_token"';
  constructor() {
    super(
      "unauthenticated",
      "This token is not valid: it is unknown, revoked, or disabled (its creator left the lab or stopped being a manager; a manager can re-issue it).",
    );
  }
}

/** 429 for a token past TOKEN_RATE_LIMIT_PER_MINUTE, with Retry-After. */
const tokenRateLimited = (seconds: number) =>
  rateLimited(`Too many requests with this token. Try again in ${seconds} second${seconds === 1 ? "" : "s"}.`, seconds);

const g = globalThis as unknown as { forkwallTokenLimiter?: RateLimiterMySQL };

// Counted in MariaDB's rate_limits (the sign-in throttle's table), so every app instance shares it.
function limiter(): RateLimiterMySQL {
  g.forkwallTokenLimiter ??= new RateLimiterMySQL({
    storeClient: pool.pool,
    storeType: "pool",
    dbName: databaseName(env.DATABASE_URL),
    tableName: "rate_limits",
    tableCreated: true,
    keyPrefix: "machine-token",
    points: env.TOKEN_RATE_LIMIT_PER_MINUTE,
    duration: 60,
  });
  return g.forkwallTokenLimiter;
}

/** True when the request authenticates with a Bearer header (and so is a machine, not a browser). */
export function hasBearer(req: Request): boolean {
  return bearerToken(req.headers.get("authorization")) !== null;
}

/**
 * The caller a Bearer request stands for: an active token (401 otherwise), counted against its
 * rate limit (429), its last use noted. The token itself is never logged or stored.
 */
export async function tokenCaller(req: Request): Promise<Caller> {
  const presented = bearerToken(req.headers.get("authorization"));
  if (presented === null || !looksLikeMachineToken(presented)) throw new BearerRefused();
  const token = await findActiveToken({ tokenHash: hashMachineToken(presented) });
  if (!token) throw new BearerRefused();
  try {
    await limiter().consume(String(token.id));
  } catch (err) {
    if (isLimiterRefusal(err)) throw tokenRateLimited(Math.max(1, Math.ceil(err.msBeforeNext / 1000)));
    throw err;
  }
  await touchToken({ tokenId: token.id });
  return { kind: "token", token };
}
