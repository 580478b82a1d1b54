import "server-only";
import type { Tx } from "@/db/queries/audit";
import { lockLab } from "@/db/queries/lab-lock";
import { AppError } from "@/lib/errors";
import { deliverPendingNotices } from "./notices";
import { runTransaction } from "./transaction";

/** The field each unique key protects, so a race that loses to it is a 409 naming that field. */
const UNIQUE_FIELDS: Record<string, { field: string; message: string }> = {
  rooms_lab_name_uq: { field: "name", message: "This lab already has a room with that name." },
  balloon_families_lab_name_uq: { field: "name", message: "This lab already has a balloon family with that name." },
  stent_platforms_lab_name_uq: { field: "name", message: "This lab already has a stent platform with that name." },
  balloons_family_diameter_uq: { field: "diameterMm", message: "This family already has this diameter." },
  stent_sizes_platform_nominal_uq: { field: "nominalMm", message: "This platform already has this nominal diameter." },
  postings_one_hanging_uq: { field: "roomId", message: "This copy is already recorded in that room." },
  memberships_lab_user_uq: { field: "email", message: "That person is already a member of this lab." },
  users_email_unique: { field: "email", message: "An account already uses that e-mail address." },
};

/** The unique key a write ran into (drizzle wraps mysql2's ER_DUP_ENTRY in `.cause`), or null. */
export function duplicateKey(err: unknown): string | null {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) {
    const { code, sqlMessage } = e as { code?: string; sqlMessage?: string };
    if (code === "ER_DUP_ENTRY") return /for key '(?:[^'.]*\.)?([^']+)'/.exec(sqlMessage ?? "")?.[1] ?? "";
  }
  return null;
}

export function conflictFor(key: string): AppError {
  const known = UNIQUE_FIELDS[key];
  if (!known)
    return new AppError("conflict", "That would duplicate something this lab already has. Reload and try again.");
  return new AppError("conflict", known.message, [{ path: [known.field], message: known.message }]);
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
    const key = duplicateKey(err);
    if (key !== null) throw conflictFor(key);
    throw err;
  }
  await deliverPendingNotices({ labId });
  return result;
}

/** A write that belongs to no one lab yet (accounts, accepting an invitation): one transaction. */
export async function accountWrite<T>(fn: (tx: Tx) => Promise<T>): Promise<T> {
  try {
    return await runTransaction((tx) => fn(tx));
  } catch (err) {
    const key = duplicateKey(err);
    if (key !== null) throw conflictFor(key);
    throw err;
  }
}
