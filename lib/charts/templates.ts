import { DEFAULT_ROUNDING_CAPS, FINET_DEFAULT_RATIO } from "@/lib/sizing";
import type { ChartDefinition } from "@/lib/validation/chart";
import { defaultLookup } from "./defaults";
import type { StockFamily } from "./snapshot";

// The chart templates a new lab's first-run path offers: a POT chart (the proximal lookup) or a
// chart for kissing-balloon inflation (side-branch and main-branch lookups). Axes start at the
// stocked range of the lab's first non-compliant family (lib/charts/defaults.ts).
export const CHART_TEMPLATES = {
  pot: { title: "POT balloon chart", kinds: ["proximal"] },
  kissing: { title: "Kissing-balloon chart", kinds: ["side", "main"] },
} as const;

export type ChartTemplate = keyof typeof CHART_TEMPLATES;

export const isChartTemplate = (v: unknown): v is ChartTemplate => v === "pot" || v === "kissing";

export function templateDefinition(
  template: ChartTemplate,
  stock: { balloonFamilies: StockFamily[]; stentPlatforms: { id: number }[] },
): ChartDefinition {
  const family = stock.balloonFamilies.find((f) => f.compliance === "nc") ?? stock.balloonFamilies[0];
  const t = CHART_TEMPLATES[template];
  return {
    title: t.title,
    law: { law: "finet", ratio: FINET_DEFAULT_RATIO },
    lookups: t.kinds.map((kind) => defaultLookup(kind, family)),
    stentPlatformId: stock.stentPlatforms[0]?.id ?? null,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
    notes: "",
    roundingCaps: { ...DEFAULT_ROUNDING_CAPS },
  };
}
