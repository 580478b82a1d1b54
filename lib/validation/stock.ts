// Stock input rules, shared by the API, the forms and the CSV import.
import { z } from "zod";
import { freeText } from "./text";

export const DIAMETER_MIN_MM = 1;
export const DIAMETER_MAX_MM = 7;
export const DIAMETER_STEP_MM = 0.05;
export const PRESSURE_MIN_ATM = 1;
export const PRESSURE_MAX_ATM = 40;
export const PRESSURE_STEP_ATM = 0.1;
export const GROWTH_MAX_MM = 1;
export const GROWTH_STEP_MM = 0.01;
export const MAX_POST_DILATATION_OVER_NOMINAL_MM = 2;
export const NAME_MAX = 120;

export const COMPLIANCES = ["nc", "sc"] as const;
export type Compliance = (typeof COMPLIANCES)[number];
export const COMPLIANCE_LABELS: Record<Compliance, string> = { nc: "Non-compliant (NC)", sc: "Semi-compliant (SC)" };

/** True when value is a whole number of steps (tolerant of binary floating-point noise). */
export function onGrid(value: number, step: number): boolean {
  const q = value / step;
  return Math.abs(q - Math.round(q)) < 1e-6;
}

/** Snaps a validated value to its grid so 2.7500000001 is stored and compared as 2.75. */
const snap = (step: number) => (value: number) => Number((Math.round(value / step) * step).toFixed(2));

const number = (label: string) =>
  z.number({
    error: (iss) =>
      iss.input === undefined || iss.input === null ? `${label} is required.` : `${label} must be a number.`,
  });

const mm = (value: number) => `${value.toFixed(2)} mm`;

export const diameterMm = (label = "Diameter") =>
  number(label)
    .min(DIAMETER_MIN_MM, `${label} must be at least ${mm(DIAMETER_MIN_MM)}.`)
    .max(DIAMETER_MAX_MM, `${label} must be at most ${mm(DIAMETER_MAX_MM)}.`)
    .refine((v) => onGrid(v, DIAMETER_STEP_MM), `${label} must be a multiple of 0.05 mm (for example 2.25 or 2.30).`)
    .transform(snap(DIAMETER_STEP_MM));

export const pressureAtm = (label: string) =>
  number(label)
    .min(PRESSURE_MIN_ATM, `${label} must be at least ${PRESSURE_MIN_ATM} atm.`)
    .max(PRESSURE_MAX_ATM, `${label} must be at most ${PRESSURE_MAX_ATM} atm.`)
    .refine((v) => onGrid(v, PRESSURE_STEP_ATM), `${label} must be given in steps of 0.1 atm.`)
    .transform(snap(PRESSURE_STEP_ATM));

export const growthMm = number("Growth at rated burst pressure")
  .min(0, "Growth at rated burst pressure cannot be negative.")
  .max(GROWTH_MAX_MM, `Growth at rated burst pressure must be at most ${mm(GROWTH_MAX_MM)}.`)
  .refine((v) => onGrid(v, GROWTH_STEP_MM), "Growth at rated burst pressure must be given in steps of 0.01 mm.")
  .transform(snap(GROWTH_STEP_MM));

export const stockName = (what: string) =>
  freeText({
    what: `${what} name`,
    min: 1,
    max: NAME_MAX,
    requiredMessage: `${what} name is required.`,
    minMessage: `Enter the ${what.toLowerCase()} name.`,
  });

export const compliance = z.enum(COMPLIANCES, {
  error: 'Compliance must be "nc" (non-compliant) or "sc" (semi-compliant).',
});
export const inStock = z.boolean({ error: "In stock must be true or false." });

const atLeastOneField = (v: object) => Object.keys(v).length > 0;
const NOTHING_TO_CHANGE = "Send at least one field to change.";

// ---------- balloon families ----------

const familyFields = z.strictObject({
  name: stockName("Family"),
  compliance,
  nominalAtm: pressureAtm("Nominal pressure"),
  rbpAtm: pressureAtm("Rated burst pressure"),
  growthAtRbpMm: growthMm.nullable().optional(),
});

/** Nominal pressure below rated burst: checked on whole values (after a patch is merged, too). */
export const balloonFamilyInput = familyFields.superRefine((v, ctx) => {
  if (v.nominalAtm >= v.rbpAtm) {
    ctx.addIssue({
      code: "custom",
      path: ["rbpAtm"],
      message: "Rated burst pressure must be above the nominal pressure.",
    });
  }
});
export const balloonFamilyPatch = familyFields.partial().refine(atLeastOneField, NOTHING_TO_CHANGE);
export type BalloonFamilyInput = z.output<typeof balloonFamilyInput>;
export type BalloonFamilyPatch = z.output<typeof balloonFamilyPatch>;

// ---------- balloons ----------

export const balloonInput = z.strictObject({ diameterMm: diameterMm(), inStock: inStock.default(true) });
export const balloonPatch = z
  .strictObject({ diameterMm: diameterMm(), inStock })
  .partial()
  .refine(atLeastOneField, NOTHING_TO_CHANGE);
export type BalloonInput = z.output<typeof balloonInput>;
export type BalloonPatch = z.output<typeof balloonPatch>;

// ---------- stent platforms and sizes ----------

export const stentPlatformInput = z.strictObject({ name: stockName("Platform") });
export type StentPlatformInput = z.output<typeof stentPlatformInput>;

const sizeFields = z.strictObject({
  nominalMm: diameterMm("Nominal diameter"),
  maxPostDilatationMm: number("Maximum post-dilatation diameter")
    .refine((v) => onGrid(v, DIAMETER_STEP_MM), "Maximum post-dilatation diameter must be a multiple of 0.05 mm.")
    .transform(snap(DIAMETER_STEP_MM)),
});

export const stentSizeInput = sizeFields.superRefine((v, ctx) => {
  if (v.maxPostDilatationMm < v.nominalMm) {
    ctx.addIssue({
      code: "custom",
      path: ["maxPostDilatationMm"],
      message: `Maximum post-dilatation diameter must be at least the nominal diameter (${mm(v.nominalMm)}).`,
    });
  } else if (v.maxPostDilatationMm > v.nominalMm + MAX_POST_DILATATION_OVER_NOMINAL_MM + 1e-9) {
    ctx.addIssue({
      code: "custom",
      path: ["maxPostDilatationMm"],
      message: `Maximum post-dilatation diameter must be at most nominal + ${mm(MAX_POST_DILATATION_OVER_NOMINAL_MM)} (${mm(v.nominalMm + MAX_POST_DILATATION_OVER_NOMINAL_MM)}).`,
    });
  }
});
export const stentSizePatch = sizeFields.partial().refine(atLeastOneField, NOTHING_TO_CHANGE);
export type StentSizeInput = z.output<typeof stentSizeInput>;
export type StentSizePatch = z.output<typeof stentSizePatch>;

// ---------- query strings ----------

const flag = z
  .enum(["1", "0", "true", "false"], { error: "Use 1 or 0 (or true or false)." })
  .optional()
  .transform((v) => v === "1" || v === "true");

export const importQuery = z.object({
  dryRun: flag,
  /** The revision the preview was made on: applying refuses when stock changed since. */
  revision: z.coerce.number({ error: "revision must be a whole number." }).int().min(0).max(2_000_000_000).optional(),
});

export const historyQuery = z.object({
  before: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER).optional(),
});
