import "server-only";
import { listApprovedCharts, listLabsForCalculator } from "@/db/queries/wall";
import { sameClinical } from "@/lib/charts/clinical";
import type { Snapshot } from "@/lib/charts/snapshot";
import { signedIn } from "./access";
import type { Caller } from "./caller";
import type { CalculatorLab } from "@/lib/calculator/choice";

export type { CalculatorChart, CalculatorLab } from "@/lib/calculator/choice";

/**
 * Everything the calculator needs to answer as the caller's labs' approved charts print, loaded
 * once: for each lab the caller belongs to, each chart's approved edition (one per chart).
 * Only the caller's own labs; drafts are never offered.
 */
export async function calculatorLabs(caller: Caller): Promise<{ labs: CalculatorLab[] }> {
  const user = signedIn(caller);
  const labs = await listLabsForCalculator({ userId: user.id });
  const rows = await listApprovedCharts({ labIds: labs.map((l) => l.id) });
  const seen = new Set<number>();
  const charts = rows.filter((r) => !seen.has(r.id) && seen.add(r.id));
  return {
    labs: labs.map((l) => ({
      slug: l.slug,
      name: l.name,
      isDemo: l.isDemo,
      charts: charts
        .filter((c) => c.labId === l.id)
        .map((c) => ({
          id: c.id,
          title: c.title,
          edition: {
            number: c.edition.number,
            approvedAt: c.edition.approvedAt?.toISOString() ?? null,
            current:
              c.edition.fingerprint === c.liveFingerprint ||
              (c.liveSnapshot !== null && sameClinical(c.edition.snapshot as Snapshot, c.liveSnapshot as Snapshot)),
          },
          snapshot: c.edition.snapshot as Snapshot,
        })),
    })),
  };
}
