// Invented, illustrative stock and charts for tests only.
import type { LabStock } from "@/lib/charts/snapshot";
import { chartDefinitionSchema } from "@/lib/validation/chart";

/** Diameters from `from` to `to` in `step` mm, rounded to the hundredth. */
export const steps = (from: number, to: number, step = 0.25) =>
  Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => Math.round((from + i * step) * 100) / 100);

/**
 * A small POT chart (Finet 0.678, A2 portrait, MB 2.5-3.5 x SB 2.0-3.0 mm) on one balloon family,
 * checked against `stentPlatformId` when given (the lab rule asks for one unless excepted).
 */
export const smallPotChart = (familyId: number, title = "POT test chart", stentPlatformId?: number) =>
  chartDefinitionSchema.parse({
    title,
    law: { law: "finet", ratio: 0.678 },
    lookups: [
      {
        kind: "proximal",
        rows: { from: 2.5, to: 3.5, step: 0.25 },
        cols: { from: 2, to: 3, step: 0.25 },
        rounding: "up",
        familyId,
      },
    ],
    ...(stentPlatformId === undefined ? {} : { stentPlatformId }),
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
  });

/** One NC family (id 1, 12/20 atm) with the given diameters, those in `outOfStock` not stocked. */
export const ncStock = (
  outOfStock: number[] = [],
  {
    diameters = steps(2, 5),
    growthAtRbpMm = 0.2 as number | null,
    stentPlatforms = [] as LabStock["stentPlatforms"],
  } = {},
): LabStock => ({
  balloonFamilies: [
    {
      id: 1,
      name: "NC test family",
      compliance: "nc",
      nominalAtm: 12,
      rbpAtm: 20,
      growthAtRbpMm,
      balloons: diameters.map((d) => ({ diameterMm: d, inStock: !outOfStock.includes(d) })),
    },
  ],
  stentPlatforms,
});
