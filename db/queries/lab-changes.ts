import "server-only";
import { and, eq } from "drizzle-orm";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { buildSnapshot } from "@/lib/charts/snapshot";
import { checkChartAgainstRules, ruledDefinition } from "@/lib/labs/rules";
import { parseStoredDefinition } from "@/lib/validation/chart";
import { charts, logos } from "../schema";
import type { Tx } from "./audit";
import { reconcilePostings } from "./notices";
import { getLabRules } from "./lab-rules-read";
import { lockLab } from "./lab-lock";
import { readStock } from "./stock-read";

export type LiveChange = { chartId: number; before: string | null; after: string };

/**
 * The one pass per lab: resolves every chart of the lab against today's stock and settings and
 * stores what an edition made now would freeze. Runs inside the transaction of the change that
 * caused it, so every app instance reads a consistent answer from the database.
 */
export async function refreshLiveSnapshots(tx: Tx, labId: number): Promise<LiveChange[]> {
  const lab = await lockLab(tx, labId);
  const stock = await readStock(tx, labId);
  const rules = await getLabRules({ labId }, tx);
  const rows = await tx
    .select({
      id: charts.id,
      definition: charts.definition,
      liveFingerprint: charts.liveFingerprint,
      logoSha256: logos.sha256,
    })
    .from(charts)
    .leftJoin(logos, eq(logos.id, charts.logoId))
    .where(eq(charts.labId, labId));
  const changed: LiveChange[] = [];
  for (const row of rows) {
    const definition = parseStoredDefinition(row.definition);
    const snapshot = buildSnapshot({
      labName: lab.name,
      labIsDemo: lab.isDemo,
      definition,
      stock,
      logoSha256: row.logoSha256 ?? null,
      ruleExceptions: checkChartAgainstRules(row.id, ruledDefinition(definition), rules).applied,
      labLimits: rules.lookups,
    });
    const fingerprint = fingerprintOf(snapshot);
    if (fingerprint === row.liveFingerprint) continue;
    await tx
      .update(charts)
      .set({ liveFingerprint: fingerprint, liveSnapshot: snapshot, liveChangedAt: new Date() })
      .where(and(eq(charts.id, row.id), eq(charts.labId, labId)));
    changed.push({ chartId: row.id, before: row.liveFingerprint, after: fingerprint });
  }
  return changed;
}

/**
 * The one pass per lab after anything that can change what its charts print or what a posted
 * copy's status is (stock, chart settings, approvals, withdrawals). Runs inside the change's own
 * transaction; the caller delivers notices after commit (deliverPendingNotices).
 */
export async function afterLabChange(tx: Tx, change: { labId: number; changeKey: string; cause: string }) {
  const changedCharts = await refreshLiveSnapshots(tx, change.labId);
  const stale = await reconcilePostings(tx, change);
  return { charts: changedCharts, stale };
}
