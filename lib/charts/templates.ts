import { chartDefaults, type LabRules } from "@/lib/labs/rules";
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

/**
 * A template's definition. With the lab's rules, it starts from the medical lead's defaults: the
 * first lookup's default law, each lookup's default rounding, and caps no larger than any of its
 * lookup kinds allows.
 */
export function templateDefinition(
  template: ChartTemplate,
  stock: { balloonFamilies: StockFamily[]; stentPlatforms: { id: number }[] },
  rules?: LabRules,
): ChartDefinition {
  const family = stock.balloonFamilies.find((f) => f.compliance === "nc") ?? stock.balloonFamilies[0];
  const t = CHART_TEMPLATES[template];
  const starts = rules ? t.kinds.map((kind) => chartDefaults(rules, kind)) : null;
  const caps = starts
    ? {
        upMm: Math.min(...starts.map((d) => d.roundingCaps.upMm)),
        downMm: Math.min(...starts.map((d) => d.roundingCaps.downMm)),
      }
    : { ...DEFAULT_ROUNDING_CAPS };
  return {
    title: t.title,
    law: starts ? starts[0]!.law : { law: "finet", ratio: FINET_DEFAULT_RATIO },
    lookups: t.kinds.map((kind, i) =>
      starts ? { ...defaultLookup(kind, family), rounding: starts[i]!.rounding } : defaultLookup(kind, family),
    ),
    stentPlatformId: stock.stentPlatforms[0]?.id ?? null,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
    notes: "",
    roundingCaps: caps,
  };
}
