import { z } from "zod";

/**
 * The lab's own rules, owned by its medical lead: how long an approved edition stays valid before
 * it is due for review, and whether managers may approve editions (the lead always may).
 */
export const labRulesSchema = z
  .object({
    reviewPeriodMonths: z
      .number({ error: "Review period must be a whole number of months" })
      .int({ error: "Review period must be a whole number of months" })
      .min(1, { error: "Review period must be at least 1 month" })
      .max(60, { error: "Review period must be at most 60 months" }),
    managersMayApprove: z.boolean({ error: "managersMayApprove must be true or false" }),
  })
  .strict();

export type LabRules = z.infer<typeof labRulesSchema>;

/** A change to some of the rules; at least one, and no unknown keys. */
export const labRulesPatchSchema = labRulesSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { error: "Name at least one rule to change" });

export const DEFAULT_LAB_RULES: LabRules = { reviewPeriodMonths: 12, managersMayApprove: false };

/** Stored rules over the defaults: a rule added later reads as its default in older rows. */
export function readLabRules(stored: unknown): LabRules {
  const merged = { ...DEFAULT_LAB_RULES, ...(stored && typeof stored === "object" ? stored : {}) };
  const parsed = labRulesSchema.safeParse(merged);
  return parsed.success ? parsed.data : DEFAULT_LAB_RULES;
}

/** The review-by date of an edition approved at `approvedAt`: the same day `months` later (UTC), clamped to month end. */
export function reviewByDate(approvedAt: Date, months: number): Date {
  const y = approvedAt.getUTCFullYear();
  const m = approvedAt.getUTCMonth() + months;
  const lastDay = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  const d = new Date(approvedAt);
  d.setUTCFullYear(y, m, Math.min(approvedAt.getUTCDate(), lastDay));
  return d;
}
