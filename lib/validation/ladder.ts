import { z } from "zod";
import { SIZE_LADDER } from "@/lib/labs/first-run";
import { compliance, diameterMm, growthMm, pressureAtm, stockName } from "./stock";

/**
 * A balloon family started from the generic size ladder. The pressures are required and have
 * no default: they come from the device's own compliance chart, entered by the manager, so no
 * number on a poster is ever one Forkwall made up.
 */
export const ladderFamilySchema = z
  .strictObject({
    name: stockName("Family"),
    compliance,
    nominalAtm: pressureAtm("Nominal pressure"),
    rbpAtm: pressureAtm("Rated burst pressure"),
    growthAtRbpMm: growthMm.nullable().default(null),
    diameters: z
      .array(diameterMm(), { error: "Choose the diameters you stock." })
      .min(1, "Tick at least one diameter you stock.")
      .max(SIZE_LADDER.length)
      .refine((ds) => ds.every((d) => SIZE_LADDER.includes(d)), "Only the ladder's diameters can be ticked here.")
      .refine((ds) => new Set(ds).size === ds.length, "A diameter is ticked twice."),
  })
  .superRefine((v, ctx) => {
    if (v.nominalAtm >= v.rbpAtm)
      ctx.addIssue({
        code: "custom",
        path: ["rbpAtm"],
        message: "Rated burst pressure must be above the nominal pressure.",
      });
  });
export type LadderFamilyInput = z.output<typeof ladderFamilySchema>;
