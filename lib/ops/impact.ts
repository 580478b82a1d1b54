import "server-only";
import type { Tx } from "@/db/queries/audit";
import { lockLab } from "@/db/queries/lab-lock";
import { readPostings } from "@/db/queries/postings";
import { outdatesOf, type Outdate } from "@/lib/stock/impact";
import { conflictFor, duplicateKey } from "./write";
import { runTransaction } from "./transaction";

/** Carries the answer out of the transaction it rolls back. */
class WhatIf extends Error {
  constructor(readonly outdates: Outdate[]) {
    super("what-if: rolled back");
  }
}

/**
 * Runs a lab write exactly as it would run (lab row locked, the change, its lab pass) and rolls it
 * back, answering which posted copies it would make outdated. Nothing commits and no mail goes.
 */
export async function whatIfLabWrite(labId: number, fn: (tx: Tx) => Promise<unknown>): Promise<Outdate[]> {
  try {
    await runTransaction(async (tx) => {
      await lockLab(tx, labId);
      const before = await readPostings(tx, labId);
      await fn(tx);
      throw new WhatIf(outdatesOf(before, await readPostings(tx, labId)));
    });
  } catch (err) {
    if (err instanceof WhatIf) return err.outdates;
    const key = duplicateKey(err);
    if (key !== null) throw conflictFor(key);
    throw err;
  }
  throw new Error("unreachable: a what-if always rolls back");
}
