import "server-only";
import { RateLimiterMySQL, RateLimiterRes, type RateLimiterAbstract } from "rate-limiter-flexible";
import { pool } from "@/db";
import { env } from "@/lib/env";
import { rateLimited } from "@/lib/errors";
import { databaseName } from "./sign-in";

// Limits on what a person can make the app do to others: labs created (each can mail invitations)
// and invitation mail per lab. Counted in MariaDB's rate_limits, so every app instance shares them.
export const LABS_PER_ACCOUNT_PER_DAY = 5;
export const INVITATION_MAILS_PER_LAB_PER_HOUR = 30;

const waitWords = (seconds: number) =>
  seconds >= 5400
    ? `${Math.ceil(seconds / 3600)} hours`
    : seconds >= 60
      ? `${Math.ceil(seconds / 60)} minutes`
      : `${seconds} second${seconds === 1 ? "" : "s"}`;

type Kind = "lab-create" | "invitation-mail";

const SPEC: Record<Kind, { points: number; duration: number; refusal: string }> = {
  "lab-create": {
    points: LABS_PER_ACCOUNT_PER_DAY,
    duration: 24 * 60 * 60,
    refusal: `You have created ${LABS_PER_ACCOUNT_PER_DAY} labs in the last day, the most allowed.`,
  },
  "invitation-mail": {
    points: INVITATION_MAILS_PER_LAB_PER_HOUR,
    duration: 60 * 60,
    refusal: `This lab has sent ${INVITATION_MAILS_PER_LAB_PER_HOUR} invitations and resends in the last hour, the most allowed.`,
  },
};

export function createLabLimits(opts: { keyPrefix?: string } = {}) {
  const limiters = new Map<Kind, RateLimiterAbstract>();
  const limiter = (kind: Kind) => {
    let l = limiters.get(kind);
    if (!l) {
      l = new RateLimiterMySQL({
        storeClient: pool.pool,
        storeType: "pool",
        dbName: databaseName(env.DATABASE_URL),
        tableName: "rate_limits",
        tableCreated: true,
        keyPrefix: `${opts.keyPrefix ?? "limit"}-${kind}`,
        points: SPEC[kind].points,
        duration: SPEC[kind].duration,
      });
      limiters.set(kind, l);
    }
    return l;
  };

  /**
   * Counts one use against `key` and runs `fn`; past the limit throws a 429 with Retry-After and runs
   * nothing. A use whose `fn` fails (a refused or conflicting write) is given back.
   */
  async function within<T>(kind: Kind, key: number, fn: () => Promise<T>): Promise<T> {
    try {
      await limiter(kind).consume(String(key));
    } catch (err) {
      if (!(err instanceof RateLimiterRes)) throw err;
      const seconds = Math.max(1, Math.ceil(err.msBeforeNext / 1000));
      throw rateLimited(`${SPEC[kind].refusal} Try again in ${waitWords(seconds)}.`, seconds);
    }
    try {
      return await fn();
    } catch (err) {
      await limiter(kind)
        .reward(String(key))
        .catch(() => {});
      throw err;
    }
  }

  return {
    /** Labs a person creates for themselves (the operator's command is not counted). */
    labCreation: <T>(userId: number, fn: () => Promise<T>) => within("lab-create", userId, fn),
    /** Invitation e-mails of one lab, first sends and resends together. */
    invitationMail: <T>(labId: number, fn: () => Promise<T>) => within("invitation-mail", labId, fn),
  };
}

const g = globalThis as unknown as { forkwallLabLimits?: ReturnType<typeof createLabLimits> };

/** The app's limits (one set per process; the counts live in the database). */
export function labLimits() {
  g.forkwallLabLimits ??= createLabLimits();
  return g.forkwallLabLimits;
}
