import { z } from "zod";
import { freeText } from "./text";
import { ORIENTATIONS, PAPER_IDS } from "@/lib/poster/paper";
import {
  DEFAULT_ROUNDING_CAPS,
  FINET_DEFAULT_RATIO,
  FINET_RATIO_MAX,
  FINET_RATIO_MIN,
  POWER_N_MAX,
  POWER_N_MIN,
  resolveAxis,
  type AxisInput,
} from "@/lib/sizing";

export const LOOKUP_KINDS = ["proximal", "side", "main"] as const;
export const ROUNDING_RULES = ["up", "down", "nearest", "reach"] as const;
export const READING_DISTANCE_MIN_M = 0.5;
export const READING_DISTANCE_MAX_M = 10;
export const ROUNDING_CAP_MAX_MM = 1;

export const lawSpecSchema = z.discriminatedUnion(
  "law",
  [
    z.object({
      law: z.literal("finet"),
      ratio: z
        .number()
        .min(FINET_RATIO_MIN, `The Finet ratio must be at least ${FINET_RATIO_MIN}`)
        .max(FINET_RATIO_MAX, `The Finet ratio must be at most ${FINET_RATIO_MAX}`)
        .default(FINET_DEFAULT_RATIO),
    }),
    z.object({ law: z.literal("murray") }),
    z.object({ law: z.literal("huo-kassab") }),
    z.object({ law: z.literal("square") }),
    z.object({
      law: z.literal("power"),
      n: z
        .number()
        .min(POWER_N_MIN, `n must be at least ${POWER_N_MIN}`)
        .max(POWER_N_MAX, `n must be at most ${POWER_N_MAX}`),
    }),
  ],
  { error: "Choose a law: finet, murray, huo-kassab, square or power" },
);

const axisSchema = z
  .union([
    z.array(z.number()).min(1, "Give at least one value").max(30),
    z.object({ from: z.number(), to: z.number(), step: z.number() }).strict(),
  ])
  .superRefine((axis, ctx) => {
    const resolved = resolveAxis(axis as AxisInput);
    if (!resolved.ok) ctx.addIssue({ code: "custom", message: resolved.reason });
  });

/** How far a printed size may differ from its exact target before the cell is marked. */
export const roundingCapsSchema = z
  .object({
    upMm: z
      .number()
      .min(0, "The cap above must be 0 mm or more")
      .max(ROUNDING_CAP_MAX_MM, `The cap above must be at most ${ROUNDING_CAP_MAX_MM} mm`)
      .default(DEFAULT_ROUNDING_CAPS.upMm),
    downMm: z
      .number()
      .min(0, "The cap below must be 0 mm or more")
      .max(ROUNDING_CAP_MAX_MM, `The cap below must be at most ${ROUNDING_CAP_MAX_MM} mm`)
      .default(DEFAULT_ROUNDING_CAPS.downMm),
  })
  .strict();

export const lookupSchema = z
  .object({
    kind: z.enum(LOOKUP_KINDS, { error: "Lookup kind must be proximal, side or main" }),
    rows: axisSchema,
    cols: axisSchema,
    rounding: z.enum(ROUNDING_RULES, { error: "Rounding must be up, down, nearest or reach" }),
    familyId: z.number().int().positive("Choose a balloon family"),
  })
  .strict();

const stentPlatformIdSchema = z.number().int().positive().nullable();
const notesSchema = freeText({
  what: "Notes",
  max: 600,
  multiline: true,
  maxMessage: "Keep notes under 600 characters",
});

export const chartDefinitionSchema = z
  .object({
    title: freeText({
      what: "Title",
      min: 1,
      max: 120,
      minMessage: "Give the chart a title",
      maxMessage: "Keep the title under 120 characters",
    }),
    law: lawSpecSchema,
    lookups: z
      .array(lookupSchema)
      .min(1, "A chart has at least one lookup")
      .max(3, "A chart has at most three lookups")
      .superRefine((lookups, ctx) => {
        const seen = new Set<string>();
        lookups.forEach((l, i) => {
          if (seen.has(l.kind))
            ctx.addIssue({ code: "custom", path: [i, "kind"], message: `The ${l.kind} lookup appears twice` });
          seen.add(l.kind);
        });
      }),
    stentPlatformId: stentPlatformIdSchema.default(null),
    paper: z.enum(PAPER_IDS, { error: `Paper must be one of ${PAPER_IDS.join(", ")}` }),
    orientation: z.enum(ORIENTATIONS, { error: "Orientation must be portrait or landscape" }),
    readingDistanceM: z
      .number()
      .min(READING_DISTANCE_MIN_M, `Reading distance must be at least ${READING_DISTANCE_MIN_M} m`)
      .max(READING_DISTANCE_MAX_M, `Reading distance must be at most ${READING_DISTANCE_MAX_M} m`),
    notes: notesSchema.default(""),
    // Until lab rules hold them, the caps live in the chart; stored charts without them take the defaults.
    roundingCaps: roundingCapsSchema.default({ ...DEFAULT_ROUNDING_CAPS }),
  })
  .strict();

export type ChartDefinition = z.infer<typeof chartDefinitionSchema>;

/**
 * PATCH accepts any subset of the definition; the merged result is validated whole. The fields
 * with defaults lose them here, so a PATCH that leaves a field out keeps the chart's own value
 * (a title change must not drop the stent platform and with it the stent-limit check).
 */
export const chartPatchSchema = chartDefinitionSchema
  .extend({ stentPlatformId: stentPlatformIdSchema, notes: notesSchema, roundingCaps: roundingCapsSchema })
  .partial()
  .strict();

/** A definition read back from the database; one that no longer validates is a server fault. */
export function parseStoredDefinition(raw: unknown): ChartDefinition {
  const parsed = chartDefinitionSchema.safeParse(raw);
  if (!parsed.success)
    throw new Error(`A stored chart definition no longer validates: ${parsed.error.issues[0]?.message}`);
  return parsed.data;
}
