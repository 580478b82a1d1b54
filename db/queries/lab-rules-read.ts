import "server-only";
import { eq } from "drizzle-orm";
import { readLabRules, type LabRules } from "@/lib/labs/rules";
import type { Database } from "../index";
import { db as defaultDb } from "../index";
import { labRules } from "../schema";
import type { Tx } from "./audit";

/** The lab's rules: its stored row over the defaults (a lab without a row has the defaults). */
export async function getLabRules({ labId }: { labId: number }, tx: Tx | Database = defaultDb): Promise<LabRules> {
  return (await getLabRulesWithRevision({ labId }, tx)).rules;
}

/** The rules and the revision a change must name (0 for a lab that never changed them). */
export async function getLabRulesWithRevision(
  { labId }: { labId: number },
  tx: Tx | Database = defaultDb,
): Promise<{ rules: LabRules; revision: number }> {
  const [row] = await tx
    .select({ rules: labRules.rules, revision: labRules.revision })
    .from(labRules)
    .where(eq(labRules.labId, labId));
  return { rules: readLabRules(row?.rules), revision: row?.revision ?? 0 };
}
