import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { AppError } from "@/lib/errors";
import {
  changedRules,
  labRulesSchema,
  mergeLabRules,
  stampExceptions,
  type LabRules,
  type LabRulesPatch,
} from "@/lib/labs/rules";
import { charts, labRules } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";
import { afterLabChange } from "./lab-changes";

import { getLabRulesWithRevision } from "./lab-rules-read";

export { getLabRules, getLabRulesWithRevision } from "./lab-rules-read";

/**
 * Changes some of the lab's rules; the caller holds the lab lock (labWrite). Audited with only
 * the changed rules, before and after; a change that changes nothing writes nothing. Exceptions
 * must name this lab's charts. A change to the lookup rules or exceptions runs the lab pass:
 * the exceptions a chart's poster prints are part of what it prints.
 */
export async function setLabRules(
  tx: Tx,
  { labId, changes, actor }: { labId: number; changes: LabRulesPatch; actor: Actor },
): Promise<{ rules: LabRules; revision: number; changed: (keyof LabRules)[] }> {
  const { revision: expected, ...patch } = changes;
  const { rules: before, revision } = await getLabRulesWithRevision({ labId }, tx);
  if (expected !== undefined && expected !== revision)
    throw new AppError(
      "conflict",
      `The rules changed since you read them (revision ${expected}; now ${revision}). Reload and make your change again.`,
      [{ path: ["revision"], message: "Stale revision" }],
    );
  const parsed = labRulesSchema.safeParse(mergeLabRules(before, patch));
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => ({ path: i.path as (string | number)[], message: i.message }));
    throw new AppError("invalid_input", `${issues[0]!.path.join(".")}: ${issues[0]!.message}`, issues);
  }
  const now = new Date();
  const after = {
    ...parsed.data,
    exceptions: stampExceptions(before.exceptions, parsed.data.exceptions, actor.name, now.toISOString().slice(0, 10)),
  };
  const chartIds = [...new Set(after.exceptions.map((e) => e.chartId))];
  if (chartIds.length) {
    const found = await tx
      .select({ id: charts.id })
      .from(charts)
      .where(and(eq(charts.labId, labId), inArray(charts.id, chartIds)));
    const bad = after.exceptions.findIndex((e) => !found.some((f) => f.id === e.chartId));
    if (bad >= 0)
      throw new AppError("invalid_input", `exceptions.${bad}.chartId: No such chart in this lab`, [
        { path: ["exceptions", bad, "chartId"], message: "No such chart in this lab" },
      ]);
  }
  const changed = changedRules(before, after);
  if (!changed.length) return { rules: before, revision, changed };
  const next = revision + 1;
  await tx
    .insert(labRules)
    .values({ labId, rules: after, revision: next, updatedBy: actor.id, updatedAt: now })
    .onDuplicateKeyUpdate({ set: { rules: after, revision: next, updatedBy: actor.id, updatedAt: now } });
  if (changed.includes("lookups") || changed.includes("exceptions"))
    await afterLabChange(tx, {
      labId,
      changeKey: `rules:${next}`,
      cause: `The lab's rules were changed by ${actor.name}`,
    });
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "lab.rules_updated",
    targetType: "lab",
    targetId: labId,
    detail: {
      revision: next,
      before: Object.fromEntries(changed.map((k) => [k, before[k]])),
      after: Object.fromEntries(changed.map((k) => [k, after[k]])),
    },
  });
  return { rules: after, revision: next, changed };
}
