import { z } from "zod";
import { ALLOWED_ROUNDING } from "@/lib/charts/rules";
import {
  DEFAULT_RBP_HEADROOM_ATM,
  DEFAULT_ROUNDING,
  DEFAULT_ROUNDING_CAPS,
  FINET_DEFAULT_RATIO,
  LAW_IDS,
  LAWS,
  POWER_N_MAX,
  POWER_N_MIN,
  formatConstant,
  type LawId,
  type LawSpec,
  type LookupKind,
  type RoundingCaps,
  type RoundingRule,
} from "@/lib/sizing";
import { LOOKUP_KINDS, ROUNDING_CAP_MAX_MM, ROUNDING_RULES, lawSpecSchema } from "@/lib/validation/chart";
import { freeText } from "@/lib/validation/text";

/**
 * The lab's own rules, owned by its medical lead: for each lookup kind the laws allowed, the
 * default law, the rounding rules and the largest rounding caps; how long an approved edition
 * stays valid before it is due for review; whether managers may approve editions (the lead
 * always may); and the exceptions the lead recorded for single charts, each with a reason.
 */

/** The rules a chart can break, and so the rules an exception can name ("legibility" is the poster's size gate). */
export const RULE_IDS = ["law", "rounding", "caps", "exponent", "no-stent-check", "legibility"] as const;
export type RuleId = (typeof RULE_IDS)[number];

export const RULE_LABELS: Readonly<Record<RuleId, string>> = {
  law: "Laws allowed",
  rounding: "Rounding rules allowed",
  caps: "Rounding caps",
  exponent: "Power-law exponent range",
  "no-stent-check": "POT checked against a stent platform",
  legibility: "Legibility at reading distance",
};

export const KIND_LABELS: Readonly<Record<LookupKind, string>> = {
  proximal: "POT (proximal) lookup",
  side: "Side-branch lookup",
  main: "Main-branch lookup",
};

const capSchema = (what: string) =>
  z
    .number({ error: `The cap ${what} must be a number of millimetres` })
    .min(0, { error: `The cap ${what} must be 0 mm or more` })
    .max(ROUNDING_CAP_MAX_MM, { error: `The cap ${what} must be at most ${ROUNDING_CAP_MAX_MM} mm` });

const exponentSchema = (what: string) =>
  z
    .number({ error: `The ${what} power-law exponent must be a number` })
    .min(POWER_N_MIN, { error: `The ${what} power-law exponent must be at least ${POWER_N_MIN}` })
    .max(POWER_N_MAX, { error: `The ${what} power-law exponent must be at most ${POWER_N_MAX}` });

/** Between the square law (n = 2) and Murray's law (n = 3): the span of the published power-form laws. */
export const DEFAULT_POWER_RANGE = { min: 2, max: 3 } as const;

const lookupRulesSchema = z
  .object({
    laws: z
      .array(z.enum(LAW_IDS as [LawId, ...LawId[]], { error: `A law must be one of ${LAW_IDS.join(", ")}` }), {
        error: "Laws must be a list of law names",
      })
      .min(1, { error: "Allow at least one law" })
      .max(LAW_IDS.length)
      .refine((v) => new Set(v).size === v.length, { error: "Name each law once" }),
    defaultLaw: lawSpecSchema,
    rounding: z
      .array(z.enum(ROUNDING_RULES, { error: "A rounding rule must be up, down, nearest or reach" }), {
        error: "Rounding must be a list of rounding rules",
      })
      .min(1, { error: "Allow at least one rounding rule" })
      .max(ROUNDING_RULES.length)
      .refine((v) => new Set(v).size === v.length, { error: "Name each rounding rule once" }),
    caps: z
      .object({ upMm: capSchema("above"), downMm: capSchema("below") }, { error: "Caps must be { upMm, downMm }" })
      .strict(),
    powerRange: z
      .object(
        {
          min: exponentSchema("lowest"),
          max: exponentSchema("highest"),
        },
        { error: "The exponent range must be { min, max }" },
      )
      .strict()
      .refine((r) => r.min <= r.max, { error: "The lowest exponent must not exceed the highest", path: ["max"] }),
    rbpHeadroomAtm: z
      .number({ error: "The headroom below rated burst pressure must be a number of atm" })
      .min(0, { error: "The headroom below rated burst pressure must be 0 atm or more" })
      .max(5, { error: "The headroom below rated burst pressure must be at most 5 atm" }),
  })
  .strict();

export type LookupRules = z.infer<typeof lookupRulesSchema>;

export const ruleExceptionSchema = z
  .object({
    chartId: z
      .number({ error: "chartId must be a chart id" })
      .int({ error: "chartId must be a chart id" })
      .positive({ error: "chartId must be a chart id" }),
    rule: z.enum(RULE_IDS, { error: `The rule must be one of ${RULE_IDS.join(", ")}` }),
    reason: freeText({
      what: "Reason",
      min: 1,
      max: 300,
      minMessage: "Give the reason for the exception",
      maxMessage: "Keep the reason under 300 characters",
    }),
    // Stamped by the server when the exception is recorded (lib/labs/rules.ts stampExceptions); sent values are ignored.
    recordedBy: z.string().max(200).optional(),
    recordedOn: z
      .string()
      .regex(/^\d{4}-\d{2}-\d{2}$/)
      .optional(),
  })
  .strict();

export type RuleException = z.infer<typeof ruleExceptionSchema>;

const lookupsSchema = z
  .object(
    { proximal: lookupRulesSchema, side: lookupRulesSchema, main: lookupRulesSchema },
    { error: "lookups must name proximal, side and main" },
  )
  .strict();

const baseShape = {
  reviewPeriodMonths: z
    .number({ error: "Review period must be a whole number of months" })
    .int({ error: "Review period must be a whole number of months" })
    .min(1, { error: "Review period must be at least 1 month" })
    .max(60, { error: "Review period must be at most 60 months" }),
  managersMayApprove: z.boolean({ error: "managersMayApprove must be true or false" }),
  lookups: lookupsSchema,
  exceptions: z
    .array(ruleExceptionSchema, { error: "exceptions must be a list" })
    .max(200, { error: "At most 200 exceptions" }),
};

/** Rules that agree with themselves: the default law is allowed, the rounding within the guardrails, one exception per chart and rule. */
function checkConsistency(
  v: { lookups?: Partial<Record<LookupKind, Partial<LookupRules>>>; exceptions?: RuleException[] },
  ctx: z.RefinementCtx,
) {
  for (const kind of LOOKUP_KINDS) {
    const r = v.lookups?.[kind];
    if (!r) continue;
    if (r.laws && r.defaultLaw && !r.laws.includes(r.defaultLaw.law))
      ctx.addIssue({
        code: "custom",
        path: ["lookups", kind, "defaultLaw"],
        message: `The default law (${LAWS[r.defaultLaw.law].name}) must be one of the laws allowed`,
      });
    const d = r.defaultLaw;
    if (d?.law === "power" && r.powerRange && (d.n < r.powerRange.min || d.n > r.powerRange.max))
      ctx.addIssue({
        code: "custom",
        path: ["lookups", kind, "defaultLaw"],
        message: `The default exponent (${formatConstant(d.n)}) must lie within the exponent range`,
      });
    r.rounding?.forEach((rule, i) => {
      if (!ALLOWED_ROUNDING[kind].includes(rule))
        ctx.addIssue({
          code: "custom",
          path: ["lookups", kind, "rounding", i],
          message: `A ${KIND_LABELS[kind].toLowerCase()} rounds ${ALLOWED_ROUNDING[kind].join(", ")} (the clinical guardrail), not ${rule}`,
        });
    });
  }
  const seen = new Set<string>();
  v.exceptions?.forEach((e, i) => {
    const key = `${e.chartId}:${e.rule}`;
    if (seen.has(key))
      ctx.addIssue({
        code: "custom",
        path: ["exceptions", i, "rule"],
        message: "This chart already has an exception to this rule",
      });
    seen.add(key);
  });
}

export const labRulesSchema = z.object(baseShape).strict().superRefine(checkConsistency);

export type LabRules = z.infer<typeof labRulesSchema>;

/**
 * A change to some of the rules; at least one, and no unknown keys. A lookup kind may name only
 * the parts it changes; `exceptions` replaces the whole list. `revision`, when given, must be the
 * revision the change was made against (409 otherwise).
 */
export const labRulesPatchSchema = z
  .object({
    reviewPeriodMonths: baseShape.reviewPeriodMonths.optional(),
    managersMayApprove: baseShape.managersMayApprove.optional(),
    lookups: z
      .object(
        {
          proximal: lookupRulesSchema.partial().strict().optional(),
          side: lookupRulesSchema.partial().strict().optional(),
          main: lookupRulesSchema.partial().strict().optional(),
        },
        { error: "lookups must be an object by lookup kind" },
      )
      .strict()
      .optional(),
    exceptions: baseShape.exceptions.optional(),
    revision: z
      .number({ error: "revision must be the revision you read" })
      .int({ error: "revision must be the revision you read" })
      .min(0, { error: "revision must be the revision you read" })
      .optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).some((k) => k !== "revision"), { error: "Name at least one rule to change" })
  .superRefine(checkConsistency);

export type LabRulesPatch = z.infer<typeof labRulesPatchSchema>;

const defaultLookupRules = (kind: LookupKind): LookupRules => ({
  laws: [...LAW_IDS],
  defaultLaw: { law: "finet", ratio: FINET_DEFAULT_RATIO },
  rounding: [...ALLOWED_ROUNDING[kind]],
  caps: { ...DEFAULT_ROUNDING_CAPS },
  powerRange: { ...DEFAULT_POWER_RANGE },
  rbpHeadroomAtm: DEFAULT_RBP_HEADROOM_ATM,
});

// The defaults allow everything the clinical guardrails allow, so a lab without rules behaves as before.
export const DEFAULT_LAB_RULES: LabRules = {
  reviewPeriodMonths: 12,
  managersMayApprove: false,
  lookups: {
    proximal: defaultLookupRules("proximal"),
    side: defaultLookupRules("side"),
    main: defaultLookupRules("main"),
  },
  exceptions: [],
};

const isObject = (v: unknown): v is Record<string, unknown> => Boolean(v) && typeof v === "object" && !Array.isArray(v);

/** `patch` over `rules`: lookup kinds merged part by part, everything else replaced. */
export function mergeLabRules(rules: LabRules, patch: Omit<LabRulesPatch, "revision">): unknown {
  const lookups = { ...rules.lookups } as Record<LookupKind, unknown>;
  for (const kind of LOOKUP_KINDS) {
    const p = patch.lookups?.[kind];
    if (p) lookups[kind] = { ...rules.lookups[kind], ...p };
  }
  return { ...rules, ...patch, lookups };
}

/** Stored rules over the defaults: a rule added later reads as its default in older rows. */
export function readLabRules(stored: unknown): LabRules {
  const s = isObject(stored) ? stored : {};
  const lookups = Object.fromEntries(
    LOOKUP_KINDS.map((k) => [
      k,
      { ...DEFAULT_LAB_RULES.lookups[k], ...(isObject(s.lookups) && isObject(s.lookups[k]) ? s.lookups[k] : {}) },
    ]),
  );
  const parsed = labRulesSchema.safeParse({ ...DEFAULT_LAB_RULES, ...s, lookups });
  return parsed.success ? parsed.data : DEFAULT_LAB_RULES;
}

/** The rule names of the top-level rules that differ (lookups compared by value). */
export function changedRules(before: LabRules, after: LabRules): (keyof LabRules)[] {
  return (Object.keys(after) as (keyof LabRules)[]).filter(
    (k) => JSON.stringify(before[k]) !== JSON.stringify(after[k]),
  );
}

/** What a chart or a frozen snapshot says about the rules: its law, its lookups, its caps and whether it names a stent platform. */
export type RuledChart = {
  law: LawSpec;
  lookups: readonly { kind: LookupKind; rounding: RoundingRule }[];
  caps: RoundingCaps;
  stentPlatform: boolean;
};

export type RuleIssue = {
  rule: RuleId;
  path: (string | number)[];
  message: string;
  /** What an exception to this breach relaxes, in the poster's words. */
  relaxes?: string;
};

/** An exception in force, as the poster, the card and the designer print it. */
export type AppliedException = {
  rule: string;
  reason: string;
  /** The rule or cap it relaxes, in words ("up to 0.5 mm above target; the lab's cap is 0.25 mm"). */
  relaxes?: string;
  recordedBy?: string;
  recordedOn?: string;
};

const lawName = (id: LawId) => LAWS[id].name;
const mm2 = (x: number) => x.toFixed(2);

/** Every lab rule the chart breaks, waived or not. */
export function labRuleIssues(chart: RuledChart, rules: LabRules): RuleIssue[] {
  const issues: RuleIssue[] = [];
  chart.lookups.forEach((l, i) => {
    const r = rules.lookups[l.kind];
    const kind = KIND_LABELS[l.kind].replace(/^(Side|Main)/, (m) => m.toLowerCase());
    if (!r.laws.includes(chart.law.law))
      issues.push({
        rule: "law",
        path: ["law"],
        message: `Lab rule "laws allowed": the medical lead allows ${r.laws.map(lawName).join(", ")} for a ${kind}, not ${lawName(chart.law.law)}`,
        relaxes: `${lawName(chart.law.law)} for a ${kind}; the lab allows ${r.laws.map(lawName).join(", ")}`,
      });
    if (!r.rounding.includes(l.rounding))
      issues.push({
        rule: "rounding",
        path: ["lookups", i, "rounding"],
        message: `Lab rule "rounding rules allowed": a ${kind} rounds ${r.rounding.join(" or ")} in this lab, not ${l.rounding}`,
        relaxes: `a ${kind} rounds ${l.rounding}; the lab allows ${r.rounding.join(" or ")}`,
      });
    const n = chart.law.law === "power" ? chart.law.n : null;
    if (n !== null && (n < r.powerRange.min - 1e-9 || n > r.powerRange.max + 1e-9))
      issues.push({
        rule: "exponent",
        path: ["law", "n"],
        message: `Lab rule "power-law exponent range": a ${kind} uses an exponent from ${formatConstant(r.powerRange.min)} to ${formatConstant(r.powerRange.max)} in this lab; the chart uses ${formatConstant(n)}`,
        relaxes: `power-law exponent n = ${formatConstant(n)} (the lab's range for a ${kind}: ${formatConstant(r.powerRange.min)} to ${formatConstant(r.powerRange.max)})`,
      });
    for (const side of ["upMm", "downMm"] as const)
      if (chart.caps[side] > r.caps[side] + 1e-9)
        issues.push({
          rule: "caps",
          path: ["roundingCaps", side],
          message: `Lab rule "rounding caps": a ${kind} may be at most ${r.caps[side]} mm ${side === "upMm" ? "above" : "below"} its target in this lab; the chart allows ${chart.caps[side]} mm`,
          relaxes: `up to ${mm2(chart.caps[side])} mm ${side === "upMm" ? "above" : "below"} target (the lab's cap for a ${kind}: ${mm2(r.caps[side])} mm; cells beyond it keep their mark)`,
        });
  });
  const pot = chart.lookups.findIndex((l) => l.kind === "proximal");
  if (pot >= 0 && !chart.stentPlatform)
    issues.push({
      rule: "no-stent-check",
      path: ["stentPlatformId"],
      message: `Lab rule "POT checked against a stent platform": a POT lookup needs a stent platform to check its balloons against, unless the medical lead records a no-stent-check exception`,
      relaxes: "POT balloons are not checked against any stent's maximum post-dilatation diameter",
    });
  // One issue per rule and field is enough to act on.
  const seen = new Set<string>();
  return issues.filter((i) => {
    const key = `${i.rule}:${i.path.join(".")}`;
    return seen.has(key) ? false : (seen.add(key), true);
  });
}

/**
 * The chart against the rules: `issues` the lead has not waived (approval is refused while there
 * are any) and the exceptions that apply, which the poster prints: those whose rule the chart
 * breaks, and every legibility exception (the poster's own gate decides when it is needed).
 */
export function checkChartAgainstRules(
  chartId: number,
  chart: RuledChart,
  rules: LabRules,
): { issues: RuleIssue[]; applied: AppliedException[] } {
  const own = rules.exceptions.filter((e) => e.chartId === chartId);
  const all = labRuleIssues(chart, rules);
  const waived = new Set(own.map((e) => e.rule));
  const broken = new Set(all.map((i) => i.rule));
  return {
    issues: all.filter((i) => !waived.has(i.rule)),
    applied: own
      .filter((e) => e.rule === "legibility" || broken.has(e.rule))
      .map((e) => ({
        rule: e.rule,
        reason: e.reason,
        relaxes: relaxedWords(e.rule, all),
        ...(e.recordedBy ? { recordedBy: e.recordedBy } : {}),
        ...(e.recordedOn ? { recordedOn: e.recordedOn } : {}),
      })),
  };
}

/** What an exception relaxes, from the breaches it excuses. */
function relaxedWords(rule: RuleId, issues: readonly RuleIssue[]): string {
  if (rule === "legibility") return "figures sized for a reader nearer than the stated reading distance";
  return issues
    .filter((i) => i.rule === rule)
    .map((i) => i.relaxes ?? i.message)
    .join("; ");
}

/**
 * Exceptions as stored: one already recorded (same chart, rule and reason) keeps who recorded it
 * and when; a new or changed one is stamped with `by` and `on`. Sent stamps are never trusted.
 */
export function stampExceptions(
  before: readonly RuleException[],
  after: readonly RuleException[],
  by: string,
  on: string,
): RuleException[] {
  return after.map(({ chartId, rule, reason }) => {
    const old = before.find((b) => b.chartId === chartId && b.rule === rule && b.reason === reason);
    return { chartId, rule, reason, recordedBy: old?.recordedBy ?? by, recordedOn: old?.recordedOn ?? on };
  });
}

/** A chart definition as the rules see it. */
export function ruledDefinition(def: {
  law: LawSpec;
  lookups: readonly { kind: LookupKind; rounding: RoundingRule }[];
  roundingCaps?: RoundingCaps;
  stentPlatformId?: number | null;
}): RuledChart {
  return {
    law: def.law,
    lookups: def.lookups,
    caps: def.roundingCaps ?? DEFAULT_ROUNDING_CAPS,
    stentPlatform: Boolean(def.stentPlatformId),
  };
}

/** A frozen snapshot as the rules see it (approval checks what the edition froze). */
export function ruledSnapshot(snap: {
  law: LawSpec;
  lookups: readonly { kind: LookupKind; rounding: RoundingRule }[];
  caps?: RoundingCaps;
  stent: unknown;
}): RuledChart {
  return {
    law: snap.law,
    lookups: snap.lookups,
    caps: snap.caps ?? DEFAULT_ROUNDING_CAPS,
    stentPlatform: snap.stent !== null && snap.stent !== undefined,
  };
}

/** Where a new chart starts: the lab's default law, rounding and caps for its first lookup. */
export function chartDefaults(rules: LabRules, kind: LookupKind) {
  const r = rules.lookups[kind];
  return {
    law: r.defaultLaw,
    rounding: r.rounding.includes(DEFAULT_ROUNDING[kind]) ? DEFAULT_ROUNDING[kind] : r.rounding[0]!,
    roundingCaps: { ...r.caps },
  };
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
