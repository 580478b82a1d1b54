import { z } from "zod";
import {
  FINET_DEFAULT_RATIO,
  FINET_RATIO_MAX,
  FINET_RATIO_MIN,
  LAW_IDS,
  MAX_DIAMETER_MM,
  MIN_DIAMETER_MM,
  POWER_N_MAX,
  POWER_N_MIN,
  type KnownDiameters,
  type LawId,
  type LawSpec,
} from "@/lib/sizing";

/** Query limits for GET /api/v1/solve. */
export const SOLVE_MAX_VALUE_LENGTH = 16;
export const SOLVE_MAX_DIAMETER_MM = MAX_DIAMETER_MM;
export const SOLVE_MIN_DIAMETER_MM = MIN_DIAMETER_MM;

const KEYS = ["law", "n", "ratio", "parent", "mb", "sb"] as const;
const DIAMETERS = ["parent", "mb", "sb"] as const;
/** Plain decimals only: no exponents, hex, Infinity or NaN. */
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)$/;

const FIXED_N_MESSAGE: Record<Exclude<LawId, "power">, string> = {
  finet: "Finet is linear and takes a ratio, not n; leave n out",
  murray: "Murray fixes n at 3; leave n out",
  "huo-kassab": "Huo-Kassab fixes n at 7/3; leave n out",
  square: "The square law fixes n at 2; leave n out",
};

export type SolveQuery = { spec: LawSpec; known: KnownDiameters };
export type QueryIssue = { path: (string | number)[]; message: string };
export type QueryRecord = Record<string, string | string[] | undefined>;

/**
 * Schema for the solve query record. Every problem is reported at once, each with the path of
 * the offending parameter ([] when the problem is the set of diameters as a whole).
 */
const queryObject = z.custom<Record<string, unknown>>(
  (v) => typeof v === "object" && v !== null && !Array.isArray(v),
  "The query must be a record of parameters",
);

// The transform reads the caller's own object, so keys such as "__proto__" are still seen and rejected.
export const solveQuerySchema = queryObject.transform((raw, ctx): SolveQuery => {
  let failed = false;
  const issue = (path: (string | number)[], message: string): null => {
    failed = true;
    ctx.addIssue({ code: "custom", path, message });
    return null;
  };

  for (const key of Object.keys(raw)) {
    if (!(KEYS as readonly string[]).includes(key)) issue([key], "Unknown query parameter");
  }

  /** undefined: absent; null: present but unusable (issue already raised). */
  const text = (key: (typeof KEYS)[number]): string | null | undefined => {
    const v = raw[key];
    if (v === undefined) return undefined;
    if (Array.isArray(v)) return issue([key], "Give this parameter once");
    if (typeof v !== "string") return issue([key], "Must be text");
    if (v.length > SOLVE_MAX_VALUE_LENGTH) {
      return issue([key], `Too long (at most ${SOLVE_MAX_VALUE_LENGTH} characters)`);
    }
    return v;
  };
  const decimal = (key: (typeof KEYS)[number], s: string): number | null => {
    const x = DECIMAL.test(s) ? Number(s) : NaN;
    if (!Number.isFinite(x)) return issue([key], "Must be a plain decimal number, e.g. 3.5");
    return x;
  };
  const inRange = (key: "n" | "ratio", min: number, max: number, what: string): number | null => {
    const s = text(key);
    if (s === undefined || s === null) return null;
    const x = decimal(key, s);
    if (x === null) return null;
    if (x < min || x > max) return issue([key], `${what} must be between ${min} and ${max}`);
    return x;
  };

  const lawText = text("law");
  let law: LawId | null = null;
  if (lawText === undefined) issue(["law"], `Give a law: ${LAW_IDS.join(", ")}`);
  else if (lawText !== null) {
    if ((LAW_IDS as readonly string[]).includes(lawText)) law = lawText as LawId;
    else issue(["law"], `Unknown law; use one of ${LAW_IDS.join(", ")}`);
  }

  const known: KnownDiameters = {};
  let given = 0;
  for (const key of DIAMETERS) {
    const s = text(key);
    if (s === undefined) continue;
    given++;
    if (s === null) continue;
    const x = decimal(key, s);
    if (x === null) continue;
    if (x <= 0) issue([key], "Must be greater than 0 mm");
    else if (x < SOLVE_MIN_DIAMETER_MM) issue([key], `Must be at least ${SOLVE_MIN_DIAMETER_MM} mm`);
    else if (x > SOLVE_MAX_DIAMETER_MM) issue([key], `Must be at most ${SOLVE_MAX_DIAMETER_MM} mm`);
    else known[key] = x;
  }
  if (given !== 2) issue([], "Give exactly two of parent, mb, sb");

  let spec: LawSpec | null = null;
  if (law === "power") {
    if (raw.n === undefined) issue(["n"], `The power law needs n, between ${POWER_N_MIN} and ${POWER_N_MAX}`);
    const n = inRange("n", POWER_N_MIN, POWER_N_MAX, "n");
    if (n !== null) spec = { law, n };
  } else if (raw.n !== undefined) {
    issue(["n"], law ? FIXED_N_MESSAGE[law] : "n applies to the power law only");
  }
  if (law === "finet") {
    const ratio =
      raw.ratio === undefined
        ? FINET_DEFAULT_RATIO
        : inRange("ratio", FINET_RATIO_MIN, FINET_RATIO_MAX, "The Finet ratio");
    if (ratio !== null) spec = { law, ratio };
  } else if (raw.ratio !== undefined) {
    issue(["ratio"], "Only the Finet law takes a ratio");
  }
  if (law === "murray" || law === "huo-kassab" || law === "square") spec = { law };

  if (failed || spec === null) return z.NEVER;
  return { spec, known };
});

export type ParsedSolveQuery = { success: true; data: SolveQuery } | { success: false; issues: QueryIssue[] };

export function parseSolveQuery(record: QueryRecord): ParsedSolveQuery {
  const parsed = solveQuerySchema.safeParse(record);
  if (parsed.success) return { success: true, data: parsed.data };
  return {
    success: false,
    issues: parsed.error.issues.map((i) => ({
      path: i.path.map((p) => (typeof p === "number" ? p : String(p))),
      message: i.message,
    })),
  };
}

/** A URL's query as a record, keeping repeated keys as arrays so they can be rejected. */
export function queryRecord(params: URLSearchParams): QueryRecord {
  const out = Object.create(null) as QueryRecord;
  for (const key of new Set(params.keys())) {
    const all = params.getAll(key);
    out[key] = all.length === 1 ? all[0] : all;
  }
  return out;
}
