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

/** Axis values in mm, both ends included; checked against the lookup's axis with the whole definition. */
const cardRangeSchema = z.tuple([z.number(), z.number()], { error: "A range is [from, to] in mm" });

export const cardSideSchema = z
  .object({
    lookup: z
      .number({ error: "Choose a lookup for this side" })
      .int("Choose a lookup for this side")
      .min(0, "Choose a lookup for this side"),
    rows: cardRangeSchema.optional(),
    cols: cardRangeSchema.optional(),
  })
  .strict();

/**
 * The badge card's two sides: which lookup each prints (its index in `lookups`, from 0) and
 * optionally which rows and columns. Null or absent: lookup 1 then 2, the middle of each axis.
 */
export const cardSchema = z
  .object({
    sides: z.tuple([cardSideSchema, cardSideSchema], { error: "The badge card has two sides: give one for each" }),
  })
  .strict();

export type CardSide = z.infer<typeof cardSideSchema>;
export type CardChoice = z.infer<typeof cardSchema>;

const stentPlatformIdSchema = z.number().int().positive().nullable();
const notesSchema = freeText({
  what: "Notes",
  max: 600,
  multiline: true,
  maxMessage: "Keep notes under 600 characters",
});

const chartFields = z
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
    card: cardSchema.nullish(),
  })
  .strict();

const mmText = (v: number) => `${v.toFixed(2)} mm`;
const onAxis = (values: readonly number[], v: number) => values.some((a) => Math.abs(a - v) < 1e-6);

/** Each card side names a lookup the chart has, and its ranges run forwards over values on that lookup's axes. */
function checkCard(def: z.infer<typeof chartFields>, ctx: z.RefinementCtx) {
  def.card?.sides.forEach((side, s) => {
    const where = `Badge card side ${s + 1}`;
    const path = ["card", "sides", s];
    const lookup = def.lookups[side.lookup];
    if (!lookup) {
      const has = def.lookups.length === 1 ? "1 lookup" : `${def.lookups.length} lookups`;
      ctx.addIssue({
        code: "custom",
        path: [...path, "lookup"],
        message: `${where}: the chart has no lookup ${side.lookup + 1} (it has ${has})`,
      });
      return;
    }
    for (const axis of ["rows", "cols"] as const) {
      const range = side[axis];
      if (!range) continue;
      const name = axis === "rows" ? "rows" : "columns";
      const [from, to] = range;
      if (from > to) {
        ctx.addIssue({
          code: "custom",
          path: [...path, axis],
          message: `${where}: the ${name} run from ${mmText(from)} to ${mmText(to)}; "from" must not be above "to"`,
        });
        continue;
      }
      // An unusable axis has its own issue on the lookup.
      const values = resolveAxis(lookup[axis] as AxisInput);
      if (!values.ok) continue;
      range.forEach((v, k) => {
        if (!onAxis(values.values, v))
          ctx.addIssue({
            code: "custom",
            path: [...path, axis, k],
            message: `${where}: ${mmText(v)} is not one of lookup ${side.lookup + 1}'s ${name} (${values.values.map((x) => x.toFixed(2)).join(", ")} mm)`,
          });
      });
    }
  });
}

export const chartDefinitionSchema = chartFields.superRefine(checkCard);

export type ChartDefinition = z.infer<typeof chartDefinitionSchema>;

/**
 * PATCH accepts any subset of the definition; the merged result is validated whole. The fields
 * with defaults lose them here, so a PATCH that leaves a field out keeps the chart's own value
 * (a title change must not drop the stent platform and with it the stent-limit check).
 */
export const chartPatchSchema = chartFields
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
