// Words printed around the grids, shared by the PDF poster and the HTML preview.
import {
  DEFAULT_ROUNDING,
  hasGrowthData,
  LOOKUP_VESSELS,
  type BalloonFamilyStock,
  type Grid,
  type LookupKind,
  type Vessel,
  type RoundingRule,
} from "@/lib/sizing";
import type { EditionStatus } from "@/lib/editions/states";
import { formatShortCode } from "@/lib/editions/short-code";
import { formatDate as isoDate } from "@/lib/format/dates";
import type { NumberFormat } from "@/lib/format/numbers";

const VESSEL_WORDS: Readonly<Record<Vessel, string>> = {
  parent: "parent",
  mb: "main branch",
  sb: "side branch",
};

const LOOKUP_HEADS: Readonly<Record<LookupKind, string>> = {
  proximal: "POT balloon (parent)",
  side: "Side-branch balloon",
  main: "Main-branch balloon",
};

/** "POT balloon (parent) from main branch × side branch": what the grid solves, from what. */
export function lookupTitle(kind: LookupKind): string {
  const vessels = LOOKUP_VESSELS[kind];
  return `${LOOKUP_HEADS[kind]} from ${VESSEL_WORDS[vessels.rows]} × ${VESSEL_WORDS[vessels.cols]}`;
}

/** Axis titles: which diameter runs down the rows and which across the columns. */
export function axisTitles(grid: Pick<Grid, "rowAxis" | "colAxis">): { rows: string; cols: string } {
  const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
  return {
    rows: `${cap(VESSEL_WORDS[grid.rowAxis.vessel])}, mm`,
    cols: `${cap(VESSEL_WORDS[grid.colAxis.vessel])}, mm`,
  };
}

/** Short symbols of the formulae (Dp, Dmb, Dsb). */
export const VESSEL_SYMBOLS: Readonly<Record<Vessel, string>> = { parent: "Dp", mb: "Dmb", sb: "Dsb" };

const RULE_WORDS: Readonly<Record<RoundingRule, string>> = {
  up: "rounded up to the next stocked size",
  down: "rounded down to the next smaller stocked size",
  nearest: "rounded to the nearest stocked size (a tie goes to the smaller)",
  reach: "the smallest stocked size that reaches the target by rated burst pressure (linear compliance)",
};

/**
 * The rounding rule in words; the designer marks the trade's usual choice for the lookup as
 * common practice, the poster (`plain`) says only what was done.
 */
export function roundingText(kind: LookupKind, rule: RoundingRule, plain = false): string {
  const usual = !plain && DEFAULT_ROUNDING[kind] === rule && rule !== "nearest" ? " (common practice)" : "";
  return `Balloon ${RULE_WORDS[rule]}${usual}`;
}

export function familyText(family: BalloonFamilyStock | null): string {
  if (!family) return "No balloon family: exact diameters only";
  return `${family.name}: ${family.compliance.toUpperCase()}, nominal ${family.nominalAtm} atm, RBP ${family.rbpAtm} atm`;
}

/** The line under a grid's title: balloon family, rounding rule and, for POT, the stent limit. */
export function gridSubtitle(
  lookup: { kind: LookupKind; rounding: RoundingRule; family: BalloonFamilyStock | null },
  stentName: string | null,
): string {
  return gridSubtitleParts(lookup, stentName).join(" · ");
}

/** The same lines one by one, as the poster prints them (plain words: no "common practice"). */
export function gridSubtitleParts(
  lookup: { kind: LookupKind; rounding: RoundingRule; family: BalloonFamilyStock | null },
  stentName: string | null,
  plain = false,
): string[] {
  const growth = lookup.family !== null && hasGrowthData(lookup.family);
  const rounding =
    lookup.rounding === "reach" && lookup.family && !growth
      ? "No growth recorded, so no pressure is printed: balloon rounded up to the next stocked size"
      : roundingText(lookup.kind, lookup.rounding, plain);
  const parts = [familyText(lookup.family), rounding];
  if (lookup.kind === "proximal") {
    if (!stentName) parts.push("Stent limit not checked (no stent platform)");
    else if (lookup.family && !growth)
      parts.push(`Stent limit: ${stentName}, checked at nominal diameter (no growth at RBP recorded)`);
    else parts.push(`Stent limit: ${stentName}, checked at RBP`);
  }
  return parts;
}

/** ISO 8601 date in the lab's time zone (lib/format/dates.ts): the one date format on a poster. */
export const formatDate = (d: Date, timeZone = "UTC") => isoDate(d, timeZone);

export type EditionLine = {
  status: EditionStatus;
  approvedAt: Date | null;
  approvedByName: string | null;
};

/** "Approved 2026-03-02 by A. Example", or "DRAFT — not approved". */
export function approvalText(e: EditionLine, timeZone = "UTC"): string {
  if (e.status === "draft" || e.status === "returned" || !e.approvedAt) return "DRAFT — not approved";
  const by = e.approvedByName ? ` by ${e.approvedByName}` : "";
  return `Approved ${formatDate(e.approvedAt, timeZone)}${by}`;
}

/** "Review by 2027-03-02": when the approved content is due for review; null for drafts. */
export function reviewText(reviewBy: Date | null | undefined, timeZone = "UTC"): string | null {
  return reviewBy ? `Review by ${formatDate(reviewBy, timeZone)}` : null;
}

/** Decimal points between digits become the lab's separator (3.25 -> 3,25 where the lab chose the comma). */
export function localiseNumbers(text: string, format: NumberFormat = "point", typed: readonly string[] = []): string {
  if (format !== "comma") return text;
  const local = (t: string) => t.replace(/(\d)\.(\d)/g, "$1,$2");
  const names = [...new Set(typed.filter((n) => n.length > 0))].sort((a, b) => b.length - a.length);
  if (!names.length) return local(text);
  // Names the lab typed keep their own separators: only the numbers the product formats change.
  const escaped = names.map((n) => n.replace(/[.*+?^${}()|[\]\\]/g, "\\$&"));
  return text
    .split(new RegExp(`(${escaped.join("|")})`))
    .map((part, i) => (i % 2 === 1 ? part : local(part)))
    .join("");
}

/** The address printed under the QR code: the app's /c/ route and the edition's short code. */
export function shortCodeUrl(appUrl: string, code: string): string {
  return `${appUrl.replace(/\/$/, "")}/c/${formatShortCode(code)}`;
}

export type FormulaRun = { text: string; sup: boolean };

/**
 * A law's formula as runs of normal and superscript text: "Dp^(7/3)" and "Dp³" both become
 * "Dp" with a raised "7/3" or "3", so the poster typesets real exponents instead of code.
 */
export function formulaRuns(formula: string): FormulaRun[] {
  const SUP: Record<string, string> = { "²": "2", "³": "3" };
  const runs: FormulaRun[] = [];
  const push = (text: string, sup: boolean) => {
    const last = runs[runs.length - 1];
    if (last && last.sup === sup) last.text += text;
    else if (text) runs.push({ text, sup });
  };
  const re = /\^\(([^)]*)\)|\^([0-9.,a-z]+)|([²³])/g;
  let at = 0;
  for (let m = re.exec(formula); m; m = re.exec(formula)) {
    push(formula.slice(at, m.index), false);
    push(m[1] ?? m[2] ?? SUP[m[3] as string] ?? "", true);
    at = m.index + m[0].length;
  }
  push(formula.slice(at), false);
  return runs;
}

/** Widest an Inter Bold character runs, in em, for a formula (figures, capitals, ×): an overestimate on purpose. */
const FORMULA_EM = 0.66;

/**
 * A formula set so that it never breaks inside an expression: whole on one line when it fits
 * `widthPt` at `sizePt`, else broken only after its "=", and shrunk until its longest line fits.
 */
export function formulaLines(formula: string, sizePt: number, widthPt: number): { lines: string[]; size: number } {
  const width = (t: string) => t.length * FORMULA_EM;
  if (width(formula) * sizePt <= widthPt) return { lines: [formula], size: sizePt };
  const at = formula.indexOf("=");
  const lines = at > 0 ? [formula.slice(0, at + 1).trimEnd(), formula.slice(at + 1).trimStart()] : [formula];
  const widest = Math.max(...lines.map(width));
  return { lines, size: Math.min(sizePt, widthPt / widest) };
}

/** The banner across a poster that must not be used as current, or null for approved ones. */
export function statusBanner(status: EditionStatus): string | null {
  switch (status) {
    case "draft":
      return "DRAFT — not approved, not for clinical use";
    case "returned":
      return "SENT BACK — not approved, not for clinical use";
    case "superseded":
      return "SUPERSEDED — a newer edition replaces this poster: scan the code and replace it";
    case "withdrawn":
      return "WITHDRAWN — do not use: take this poster off the wall";
    case "approved":
      return null;
  }
}

/** States whose every printed page carries a diagonal stamp: all but a current approved edition. */
export type StampState = "draft" | "returned" | "withdrawn" | "superseded" | "outdated";

/** The stamp's words, exactly (plain ASCII: the stamp is set in the PDF standard Helvetica). */
export const STAMP_WORDS: Readonly<Record<StampState, string>> = {
  draft: "DRAFT - NOT FOR CLINICAL USE",
  returned: "RETURNED - NOT FOR CLINICAL USE",
  withdrawn: "WITHDRAWN - DO NOT POST",
  superseded: "NOT CURRENT - DO NOT POST",
  outdated: "NOT CURRENT - DO NOT POST",
};

/** The check URL without its scheme, for printing beside the QR code. */
export function shortUrl(url: string): string {
  return url.replace(/^https?:\/\//, "").replace(/\/$/, "");
}
