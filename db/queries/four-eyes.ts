import "server-only";
import { and, desc, eq, gt, inArray, isNotNull, like, max, or } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { auditEvents, editions, labTokens } from "../schema";
import type { Tx } from "./audit";

/** Chart audit actions that change what the chart prints or says. */
const CHART_CONTENT_ACTIONS = ["chart.created", "chart.updated", "chart.logo_set", "chart.logo_removed"];

/**
 * What the four-eyes decision (lib/editions/four-eyes.ts) reads about one edition and one
 * approver, inside the approval's transaction (the lab lock orders audit ids). Reads only.
 * "Since" is the audit row of the chart's last approval; with none, the chart's whole history.
 */
export async function readFourEyesFacts(
  tx: Tx,
  { labId, editionId, userId }: { labId: number; editionId: number; userId: number },
) {
  const [draft] = await tx
    .select({
      chartId: editions.chartId,
      status: editions.status,
      createdBy: editions.createdBy,
      snapshot: editions.snapshot,
    })
    .from(editions)
    .where(and(eq(editions.id, editionId), eq(editions.labId, labId)));
  if (!draft) return null;
  const approved = await tx
    .select({ id: editions.id, snapshot: editions.snapshot })
    .from(editions)
    .where(and(eq(editions.chartId, draft.chartId), eq(editions.labId, labId), isNotNull(editions.approvedAt)))
    .orderBy(desc(editions.approvedAt), desc(editions.id));
  let since = 0;
  if (approved.length) {
    const [last] = await tx
      .select({ id: max(auditEvents.id) })
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.labId, labId),
          eq(auditEvents.action, "edition.approved"),
          eq(auditEvents.targetType, "edition"),
          inArray(
            auditEvents.targetId,
            approved.map((e) => String(e.id)),
          ),
        ),
      );
    since = last?.id ?? 0;
  }
  const after = and(eq(auditEvents.labId, labId), gt(auditEvents.id, since));
  const chartChanges = await tx
    .select({ action: auditEvents.action })
    .from(auditEvents)
    .where(
      and(
        after,
        eq(auditEvents.actorUserId, userId),
        eq(auditEvents.targetType, "chart"),
        eq(auditEvents.targetId, String(draft.chartId)),
        inArray(auditEvents.action, CHART_CONTENT_ACTIONS),
      ),
    )
    .orderBy(auditEvents.id);
  const theirTokens = tx
    .select({ id: labTokens.id })
    .from(labTokens)
    .where(and(eq(labTokens.labId, labId), eq(labTokens.createdBy, userId)));
  const stockChanges = await tx
    .select({ action: auditEvents.action, detail: auditEvents.detail })
    .from(auditEvents)
    .where(
      and(
        after,
        like(auditEvents.action, "stock.%"),
        or(eq(auditEvents.actorUserId, userId), inArray(auditEvents.actorTokenId, theirTokens)),
      ),
    )
    .orderBy(auditEvents.id);
  const rulesChanges = await tx
    .select({ detail: auditEvents.detail })
    .from(auditEvents)
    .where(and(after, eq(auditEvents.actorUserId, userId), eq(auditEvents.action, "lab.rules_updated")))
    .orderBy(auditEvents.id);
  return {
    chartId: draft.chartId,
    status: draft.status,
    createdBy: draft.createdBy,
    snapshot: draft.snapshot as Snapshot,
    lastApproved: approved.length ? (approved[0]!.snapshot as Snapshot) : null,
    chartChanges,
    stockChanges,
    rulesChanges,
  };
}
