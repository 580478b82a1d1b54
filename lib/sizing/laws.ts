import { formatDecimal } from "./format";
import { lawFit } from "./fit";
import type { LawSpec } from "./law-spec";

export type LawId = "finet" | "murray" | "huo-kassab" | "square" | "power";

export type { LawSpec } from "./law-spec";

export type Vessel = "parent" | "mb" | "sb";

export type KnownDiameters = { parent?: number; mb?: number; sb?: number };

export type SolveOk = { ok: true; solved: Vessel; diameterMm: number; warnings: string[] };
export type SolveFail = { ok: false; code: "no_solution"; reason: string };
export type SolveResult = SolveOk | SolveFail;

export const LAW_IDS: readonly LawId[] = ["finet", "murray", "huo-kassab", "square", "power"];

export const FINET_DEFAULT_RATIO = 0.678;
export const FINET_RATIO_MIN = 0.55;
export const FINET_RATIO_MAX = 0.8;
export const POWER_N_MIN = 1.5;
export const POWER_N_MAX = 3.5;
export const MURRAY_N = 3;
export const HUO_KASSAB_N = 7 / 3;
export const SQUARE_N = 2;

/**
 * A computed diameter within this many mm of a given one counts as equal to it: a computed
 * parent must exceed the main branch by more, a computed side branch up to this much above the
 * main branch is taken as equal. Given diameters are compared exactly.
 */
export const GEOMETRY_EPS_MM = 1e-9;

/**
 * The meaningful geometry: every diameter given to or produced by the engine lies within
 * MIN_DIAMETER_MM..MAX_DIAMETER_MM, and a parent less than MIN_PARENT_STEP_MM above the main
 * branch is not a bifurcation (no size). Bounds of the trade, not of any law (common practice).
 */
export const MIN_DIAMETER_MM = 0.5;
export const MAX_DIAMETER_MM = 10;
export const MIN_PARENT_STEP_MM = 0.05;

export type LawInfo = {
  id: LawId;
  name: string;
  /** Formula with the law's default constant (Finet 0.678; power shows n). */
  formula: string;
  source: string;
};

export const LAWS: Readonly<Record<LawId, LawInfo>> = {
  finet: {
    // Title, authors, journal and year are verified against the journal's article page; the
    // volume and pages (3:490-498, from memory) are not, so nothing printed carries them.
    id: "finet",
    name: "Finet",
    formula: "Dp = 0.678 × (Dmb + Dsb)",
    source:
      "Finet G, Gilard M, Perrenot B, et al. Fractal geometry of arterial coronary bifurcations: a QCA and IVUS analysis. EuroIntervention (2008)",
  },
  murray: {
    id: "murray",
    name: "Murray",
    formula: "Dp³ = Dmb³ + Dsb³",
    source: "Murray CD. The physiological principle of minimum work: I. PNAS 1926;12:207-214",
  },
  "huo-kassab": {
    id: "huo-kassab",
    name: "Huo-Kassab",
    formula: "Dp^(7/3) = Dmb^(7/3) + Dsb^(7/3)",
    source:
      "Huo Y, Kassab GS. Biophys J 2009 (exponent 7/3); applied to PCI in Huo Y, Finet G, Lefevre T, et al. EuroIntervention 2012;7(11), doi 10.4244/EIJV7I11A206",
  },
  square: {
    id: "square",
    name: "Square (area-preserving)",
    formula: "Dp² = Dmb² + Dsb²",
    source:
      "Area-preservation model as compared in Huo Y, Finet G, Lefevre T, et al. EuroIntervention 2012;7(11), doi 10.4244/EIJV7I11A206",
  },
  power: {
    id: "power",
    name: "Power",
    formula: "Dp^n = Dmb^n + Dsb^n",
    source:
      "Generalisation of the power laws; n of 2.15 to 2.38 fitted in human coronaries: Taylor DJ et al., Front Physiol 2022, doi 10.3389/fphys.2022.871912",
  },
};

/** The exponents Taylor DJ et al. (Front Physiol 2022, doi 10.3389/fphys.2022.871912) fitted in human coronaries. */
export const POWER_FITTED_N_MIN = 2.15;
export const POWER_FITTED_N_MAX = 2.38;

/**
 * The citation printed under a chart: the law's source; for the power law, the exponent used and
 * whether it lies within the cited study's fitted range, in plain words.
 */
export function lawCitation(spec: LawSpec): string {
  if (spec.law !== "power") return LAWS[spec.law].source;
  const n = formatConstant(spec.n);
  const inside = spec.n >= POWER_FITTED_N_MIN - 1e-9 && spec.n <= POWER_FITTED_N_MAX + 1e-9;
  return `Power law with n = ${n}, chosen by the lab; ${
    inside ? "within" : "OUTSIDE"
  } the range n = ${POWER_FITTED_N_MIN} to ${POWER_FITTED_N_MAX} fitted in human coronaries by Taylor DJ et al., Front Physiol 2022, doi 10.3389/fphys.2022.871912${
    inside ? "" : ": that study does not support this exponent"
  }`;
}

/** Short decimal text without floating-point noise (0.678, 2.3, 7/3 -> 2.33333333333). */
export function formatConstant(x: number): string {
  return String(Number(x.toPrecision(12)));
}

/** The exponent of a power-form law; null for Finet, which is linear. */
export function lawExponent(spec: LawSpec): number | null {
  switch (spec.law) {
    case "finet":
      return null;
    case "murray":
      return MURRAY_N;
    case "huo-kassab":
      return HUO_KASSAB_N;
    case "square":
      return SQUARE_N;
    case "power":
      return spec.n;
  }
}

export function lawFormula(spec: LawSpec): string {
  switch (spec.law) {
    case "finet":
      return `Dp = ${formatConstant(spec.ratio)} × (Dmb + Dsb)`;
    case "power": {
      const n = formatConstant(spec.n);
      return `Dp^${n} = Dmb^${n} + Dsb^${n}`;
    }
    default:
      return LAWS[spec.law].formula;
  }
}

/** Display name carrying the spec's own constant, e.g. "Finet (ratio 0.7)", "Power (n = 2.3)". */
export function lawName(spec: LawSpec): string {
  if (spec.law === "finet") return `Finet (ratio ${formatConstant(spec.ratio)})`;
  if (spec.law === "power") return `Power (n = ${formatConstant(spec.n)})`;
  return LAWS[spec.law].name;
}

/** Why a spec is unusable, or null when it is within the allowed bounds. */
export function lawSpecProblem(spec: LawSpec): string | null {
  if (!LAW_IDS.includes(spec.law)) return "Unknown law";
  if (spec.law === "finet") {
    const r = spec.ratio;
    if (!Number.isFinite(r) || r < FINET_RATIO_MIN || r > FINET_RATIO_MAX) {
      return `The Finet ratio must be between ${FINET_RATIO_MIN} and ${FINET_RATIO_MAX}`;
    }
  }
  if (spec.law === "power") {
    const n = spec.n;
    if (!Number.isFinite(n) || n < POWER_N_MIN || n > POWER_N_MAX) {
      return `The power-law exponent n must be between ${POWER_N_MIN} and ${POWER_N_MAX}`;
    }
  }
  return null;
}

/** True when the three diameters form a size: parent > mb >= sb > 0. */
export function isSize(parent: number, mb: number, sb: number): boolean {
  const finite = Number.isFinite(parent) && Number.isFinite(mb) && Number.isFinite(sb);
  return finite && parent > mb && mb >= sb && sb > 0;
}

const fail = (reason: string): SolveFail => ({ ok: false, code: "no_solution", reason });
const fmt3 = (x: number): string => formatDecimal(x, 3);

/**
 * A figure in a refusal, printed so it explains the refusal: three decimals, or as many more (up
 * to six) as it takes to show the value on its side of `limit` (0.0499 mm, not 0.050 mm, below 0.05).
 */
export function figureAgainst(value: number, limit: number): string {
  for (let d = 3; d < 6; d++) {
    const shown = Number(formatDecimal(value, d));
    if (Math.sign(shown - limit) === Math.sign(value - limit)) return formatDecimal(value, d, 3);
  }
  return formatDecimal(value, 6, 3);
}

/**
 * Solves the one unknown diameter (mm) from the two given. Throws RangeError when the spec is
 * out of bounds or not exactly two diameters are given (caller errors, caught by validation);
 * impossible geometry is never a number but a `no_solution` with a plain-words reason.
 */
export function solve(spec: LawSpec, known: KnownDiameters): SolveResult {
  const problem = lawSpecProblem(spec);
  if (problem) throw new RangeError(problem);
  const given = (["parent", "mb", "sb"] as const).filter((k) => known[k] !== undefined);
  if (given.length !== 2) throw new RangeError("Give exactly two of parent, mb, sb");
  for (const k of given) {
    const v = known[k] as number;
    if (!Number.isFinite(v)) return fail("Diameters must be numbers in mm");
    if (v <= 0) return fail("Diameters must be greater than zero");
    if (v < MIN_DIAMETER_MM - GEOMETRY_EPS_MM || v > MAX_DIAMETER_MM + GEOMETRY_EPS_MM) {
      return fail(`Diameters must be between ${MIN_DIAMETER_MM} and ${MAX_DIAMETER_MM} mm`);
    }
  }
  const { parent, mb, sb } = known;
  let result: { solved: Vessel; value: number } | SolveFail;
  if (parent === undefined) result = solveParent(spec, mb as number, sb as number);
  else if (sb === undefined) result = solveSide(spec, parent, mb as number);
  else result = solveMain(spec, parent, sb);
  if ("ok" in result) return result;

  const triple = { parent, mb, sb, [result.solved]: result.value } as Required<KnownDiameters>;
  if (!isSize(triple.parent, triple.mb, triple.sb)) {
    return fail("These diameters do not form a bifurcation (parent > main branch ≥ side branch > 0)");
  }
  if (triple.parent - triple.mb < MIN_PARENT_STEP_MM - GEOMETRY_EPS_MM) {
    return fail(
      `Not a bifurcation: the parent is less than ${MIN_PARENT_STEP_MM} mm above the main branch ` +
        `(here ${figureAgainst(triple.parent - triple.mb, MIN_PARENT_STEP_MM)} mm)`,
    );
  }
  if (result.value < MIN_DIAMETER_MM - GEOMETRY_EPS_MM || result.value > MAX_DIAMETER_MM + GEOMETRY_EPS_MM) {
    return fail(
      `The ${result.solved === "mb" ? "main branch" : result.solved === "sb" ? "side branch" : "parent"} ` +
        `would be ${figureAgainst(result.value, result.value < MIN_DIAMETER_MM ? MIN_DIAMETER_MM : MAX_DIAMETER_MM)} mm, outside the meaningful ${MIN_DIAMETER_MM}-${MAX_DIAMETER_MM} mm`,
    );
  }
  const fit = lawFit(spec, triple.mb, triple.sb);
  return {
    ok: true,
    solved: result.solved,
    diameterMm: result.value,
    warnings: fit.withinPublishedFit ? [] : [fit.note],
  };
}

function solveParent(spec: LawSpec, mb: number, sb: number): { solved: Vessel; value: number } | SolveFail {
  if (sb > mb) return fail("The side branch cannot be larger than the main branch");
  let parent: number;
  if (spec.law === "finet") {
    parent = spec.ratio * (mb + sb);
    if (parent - mb <= GEOMETRY_EPS_MM) {
      const threshold = (1 - spec.ratio) / spec.ratio;
      return fail(
        `${lawName(spec)} gives a parent no larger than the main branch when the side branch is ` +
          `${fmt3(threshold)} of the main branch or less (here ${figureAgainst(sb / mb, threshold)})`,
      );
    }
  } else {
    const n = lawExponent(spec) as number;
    parent = mb * Math.pow(1 + Math.pow(sb / mb, n), 1 / n);
    if (parent - mb <= GEOMETRY_EPS_MM) {
      return fail("The side branch is too small to change the parent under this law");
    }
  }
  return { solved: "parent", value: parent };
}

function solveSide(spec: LawSpec, parent: number, mb: number): { solved: Vessel; value: number } | SolveFail {
  if (mb >= parent) {
    return fail("With the main branch at or above the parent, no side branch fits this law");
  }
  let sb: number;
  let limit: number;
  if (spec.law === "finet") {
    sb = parent / spec.ratio - mb;
    limit = 2 * spec.ratio;
  } else {
    const n = lawExponent(spec) as number;
    // (p/mb)^n - 1 via expm1/log1p keeps precision when the parent is close to the main branch.
    sb = mb * Math.pow(Math.expm1(n * Math.log1p((parent - mb) / mb)), 1 / n);
    limit = Math.pow(2, 1 / n);
  }
  if (sb - mb > GEOMETRY_EPS_MM) {
    return fail(
      `${lawName(spec)} gives a side branch larger than the main branch when the parent is more than ` +
        `${fmt3(limit)} times the main branch (here ${figureAgainst(parent / mb, limit)})`,
    );
  }
  if (!(sb > GEOMETRY_EPS_MM)) return fail("No side branch of positive size fits this law");
  return { solved: "sb", value: Math.min(sb, mb) };
}

function solveMain(spec: LawSpec, parent: number, sb: number): { solved: Vessel; value: number } | SolveFail {
  if (sb >= parent) {
    return fail("With the side branch at or above the parent, no main branch fits this law");
  }
  let mb: number;
  if (spec.law === "finet") {
    mb = parent / spec.ratio - sb;
    if (mb - parent >= -GEOMETRY_EPS_MM) {
      const threshold = (1 - spec.ratio) / spec.ratio;
      return fail(
        `${lawName(spec)} gives a main branch at or above the parent when the side branch is ` +
          `${fmt3(threshold)} of the parent or less (here ${figureAgainst(sb / parent, threshold)})`,
      );
    }
    if (sb - mb > GEOMETRY_EPS_MM) {
      return fail(
        `${lawName(spec)} gives a main branch smaller than the side branch when the side branch is ` +
          `more than ${fmt3(1 / (2 * spec.ratio))} of the parent (here ${figureAgainst(sb / parent, 1 / (2 * spec.ratio))})`,
      );
    }
  } else {
    const n = lawExponent(spec) as number;
    mb = parent * Math.pow(-Math.expm1(n * Math.log(sb / parent)), 1 / n);
    if (sb - mb > GEOMETRY_EPS_MM) {
      return fail(
        `${lawName(spec)} gives a main branch smaller than the side branch when the parent is under ` +
          `${fmt3(Math.pow(2, 1 / n))} times the side branch (here ${figureAgainst(parent / sb, Math.pow(2, 1 / n))})`,
      );
    }
    if (mb - parent >= -GEOMETRY_EPS_MM) {
      return fail("The side branch is too small to change the main branch under this law");
    }
  }
  return { solved: "mb", value: Math.max(mb, sb) };
}
