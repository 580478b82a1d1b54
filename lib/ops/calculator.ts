import "server-only";
import { listLabsForCalculator, listLiveCharts } from "@/db/queries/wall";
import type { Snapshot } from "@/lib/charts/snapshot";
import { signedIn } from "./access";
import type { Caller } from "./caller";

export type CalculatorLab = {
  slug: string;
  name: string;
  isDemo: boolean;
  charts: { id: number; title: string; snapshot: Snapshot }[];
};

/**
 * Everything the calculator needs to answer as the caller's labs' charts would, loaded once:
 * for each lab the caller belongs to, its charts resolved against today's stock (law, balloon
 * family, rounding rule, caps, stent platform). Only the caller's own labs.
 */
export async function calculatorLabs(caller: Caller): Promise<{ labs: CalculatorLab[] }> {
  const user = signedIn(caller);
  const labs = await listLabsForCalculator({ userId: user.id });
  const charts = await listLiveCharts({ labIds: labs.map((l) => l.id) });
  return {
    labs: labs.map((l) => ({
      slug: l.slug,
      name: l.name,
      isDemo: l.isDemo,
      charts: charts
        .filter((c) => c.labId === l.id && c.liveSnapshot)
        .map((c) => ({ id: c.id, title: c.title, snapshot: c.liveSnapshot as Snapshot })),
    })),
  };
}
