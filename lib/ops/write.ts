import "server-only";
import type { Tx } from "@/db/queries/audit";
import { lockLab } from "@/db/queries/lab-lock";
import { AppError } from "@/lib/errors";
import { deliverPendingNotices } from "./notices";
import { runTransaction } from "./transaction";

function duplicateKey(err: unknown): string | null {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: string }).code === "ER_DUP_ENTRY") return (e as { sqlMessage?: string }).sqlMessage ?? "";
  }
  return null;
}

/**
 * The one write path into a lab: one transaction that locks the lab row first (writes to a lab
 * run one at a time, on any app instance), runs the change (which records its audit row and runs
 * the lab pass inside the same transaction), and after commit delivers what the change left to
 * mail. A unique-key race becomes 409.
 */
export async function labWrite<T>(labId: number, fn: (tx: Tx) => Promise<T>): Promise<T> {
  let result: T;
  try {
    // On a cluster the loser of a race between nodes fails at commit and runs again (runTransaction).
    result = await runTransaction(async (tx) => {
      await lockLab(tx, labId);
      return fn(tx);
    });
  } catch (err) {
    if (duplicateKey(err) !== null)
      throw new AppError("conflict", "That would duplicate something this lab already has. Reload and try again.");
    throw err;
  }
  await deliverPendingNotices({ labId });
  return result;
}

/** A write that belongs to no one lab yet (accounts, accepting an invitation): one transaction. */
export async function accountWrite<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
  return runTransaction((tx) => fn(tx));
}
