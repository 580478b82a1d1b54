// The one way a write transaction runs. On one MariaDB server two writers to the same lab queue
// on the lab row; on a Galera cluster row locks do not cross nodes, so the loser of a race
// between nodes fails at COMMIT with a deadlock error (certification conflict). Either way the
// whole transaction is run again, a bounded number of times with a random back-off, and work
// that must not repeat (mail, notices) runs once, after the commit that succeeded.
import { db as defaultDb, type Database } from "@/db";
import { env } from "@/lib/env";

export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

/** MariaDB errors after which running the same transaction again is the documented remedy. */
export const RETRYABLE_ERRORS: Record<string, number> = {
  ER_LOCK_DEADLOCK: 1213, // deadlock, and a Galera certification conflict or brute-force abort
  ER_LOCK_WAIT_TIMEOUT: 1205,
};
const RETRYABLE_ERRNOS = new Set(Object.values(RETRYABLE_ERRORS));

/** The retryable MariaDB error inside `err` (drizzle wraps mysql2's error in `.cause`), or null. */
export function retryableError(err: unknown): string | null {
  const seen = new Set<unknown>();
  for (let e: unknown = err; e && typeof e === "object" && !seen.has(e); e = (e as { cause?: unknown }).cause) {
    seen.add(e);
    const { code, errno } = e as { code?: unknown; errno?: unknown };
    if (typeof code === "string" && code in RETRYABLE_ERRORS) return code;
    if (typeof errno === "number" && RETRYABLE_ERRNOS.has(errno)) return `errno ${errno}`;
  }
  return null;
}

export type AfterCommit = () => unknown;

export type TxContext = {
  /** 0 on the first run, 1 on the first retry, … */
  attempt: number;
  /** Queues work for after the commit; dropped when this attempt rolls back. */
  afterCommit(effect: AfterCommit): void;
};

export type TransactionOptions<T> = {
  /** Attempts after the first; defaults to WRITE_RETRIES (5). */
  retries?: number;
  /** Runs once after the successful commit, after the effects the transaction queued. */
  afterCommit?: (result: T) => unknown;
  /** The database to run on (tests pass their own pool); the app's pool otherwise. */
  db?: Database;
  /** Back-off before retry n is random in [0, min(maxDelayMs, baseDelayMs * 2^n)). */
  baseDelayMs?: number;
  maxDelayMs?: number;
  /** Told about each retry (tests count them; the log could). */
  onRetry?: (info: { attempt: number; error: string; delayMs: number }) => void;
};

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Runs `fn` in a transaction and commits; on a deadlock or lock-wait error (at any statement or
 * at COMMIT) rolls back and runs it again, up to `retries` more times. `fn` must therefore do
 * nothing outside the database: it queues side effects with `ctx.afterCommit`, or the caller
 * passes `options.afterCommit`. Other errors, and the last retryable one, are thrown as they are.
 */
export async function runTransaction<T>(
  fn: (tx: Tx, ctx: TxContext) => Promise<T>,
  options: TransactionOptions<T> = {},
): Promise<T> {
  const database = options.db ?? defaultDb;
  const retries = options.retries ?? env.WRITE_RETRIES;
  const base = options.baseDelayMs ?? 15;
  const cap = options.maxDelayMs ?? 400;
  for (let attempt = 0; ; attempt++) {
    const effects: AfterCommit[] = [];
    let result: T;
    try {
      result = await database.transaction((tx) => fn(tx, { attempt, afterCommit: (e) => void effects.push(e) }));
    } catch (err) {
      const error = retryableError(err);
      if (!error || attempt >= retries) throw err;
      const delayMs = Math.random() * Math.min(cap, base * 2 ** attempt);
      options.onRetry?.({ attempt: attempt + 1, error, delayMs });
      await sleep(delayMs);
      continue;
    }
    // Committed: never retried from here on.
    for (const effect of effects) await effect();
    await options.afterCommit?.(result);
    return result;
  }
}
