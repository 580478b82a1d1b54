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

/** The rounding rule in words; marks the trade's usual choice for the lookup as common practice. */
export function roundingText(kind: LookupKind, rule: RoundingRule): string {
  const usual = DEFAULT_ROUNDING[kind] === rule && rule !== "nearest" ? " (common practice)" : "";
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
  const growth = lookup.family !== null && hasGrowthData(lookup.family);
  const rounding =
    lookup.rounding === "reach" && lookup.family && !growth
      ? "No growth recorded, so no pressure is printed: balloon rounded up to the next stocked size"
      : roundingText(lookup.kind, lookup.rounding);
  const parts = [familyText(lookup.family), rounding];
  if (lookup.kind === "proximal") {
    if (!stentName) parts.push("Stent limit not checked (no stent platform)");
    else if (lookup.family && !growth)
      parts.push(`Stent limit: ${stentName}, checked at nominal diameter (no growth at RBP recorded)`);
    else parts.push(`Stent limit: ${stentName}, checked at RBP`);
  }
  return parts.join(" · ");
}

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** "2 Mar 2026" in UTC: unambiguous in every locale and the same on every server. */
export function formatDate(d: Date): string {
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}

export type EditionLine = {
  status: EditionStatus;
  approvedAt: Date | null;
  approvedByName: string | null;
};

/** "Approved 2 Mar 2026 by A. Example", or "DRAFT — not approved". */
export function approvalText(e: EditionLine): string {
  if (e.status === "draft" || e.status === "returned" || !e.approvedAt) return "DRAFT — not approved";
  const by = e.approvedByName ? ` by ${e.approvedByName}` : "";
  return `Approved ${formatDate(e.approvedAt)}${by}`;
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

export const DRAFT_WATERMARK = "DRAFT - not for clinical use";

/** The check URL without its scheme, for printing beside the QR code. */
export function shortUrl(url: string): string {
  return url.replace(/^https?:\/\//, "").replace(/\/$/, "");
}
