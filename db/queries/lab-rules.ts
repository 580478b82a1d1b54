import "server-only";
import { eq } from "drizzle-orm";
import { readLabRules, type LabRules } from "@/lib/labs/rules";
import type { Database } from "../index";
import { db as defaultDb } from "../index";
import { labRules } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";

/** The lab's rules: its stored row over the defaults (a lab without a row has the defaults). */
export async function getLabRules({ labId }: { labId: number }, tx: Tx | Database = defaultDb): Promise<LabRules> {
  const [row] = await tx.select({ rules: labRules.rules }).from(labRules).where(eq(labRules.labId, labId));
  return readLabRules(row?.rules);
}

/**
 * Changes some of the lab's rules; the caller holds the lab lock (labWrite). Audited with only
 * the changed rules, before and after; a change that changes nothing writes nothing.
 */
export async function setLabRules(
  tx: Tx,
  { labId, changes, actor }: { labId: number; changes: Partial<LabRules>; actor: Actor },
): Promise<{ rules: LabRules; changed: (keyof LabRules)[] }> {
  const before = await getLabRules({ labId }, tx);
  const after: LabRules = { ...before, ...changes };
  const changed = (Object.keys(after) as (keyof LabRules)[]).filter((k) => after[k] !== before[k]);
  if (!changed.length) return { rules: before, changed };
  const now = new Date();
  await tx
    .insert(labRules)
    .values({ labId, rules: after, updatedBy: actor.id, updatedAt: now })
    .onDuplicateKeyUpdate({ set: { rules: after, updatedBy: actor.id, updatedAt: now } });
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "lab.rules_updated",
    targetType: "lab",
    targetId: labId,
    detail: {
      before: Object.fromEntries(changed.map((k) => [k, before[k]])),
      after: Object.fromEntries(changed.map((k) => [k, after[k]])),
    },
  });
  return { rules: after, changed };
}
