import { cautionFor } from "@/lib/cautions";
import type { Orientation, PaperId } from "@/lib/poster/paper";
import {
  buildGrid,
  DEFAULT_RBP_HEADROOM_ATM,
  DEFAULT_ROUNDING_CAPS,
  STOCK_TOLERANCE_MM,
  type RoundingCaps,
  type BalloonFamilyStock,
  type Grid,
  type LawSpec,
  type LookupKind,
  type RoundingRule,
  type StentSize,
} from "@/lib/sizing";
import type { CardSide, ChartDefinition } from "@/lib/validation/chart";
import type { AppliedException } from "@/lib/labs/rules";

/** The lab's stock as the stock API returns it. */
export type StockFamily = {
  id: number;
  name: string;
  compliance: "nc" | "sc";
  nominalAtm: number;
  rbpAtm: number;
  growthAtRbpMm: number | null;
  balloons: { diameterMm: number; inStock: boolean }[];
};
export type StockPlatform = { id: number; name: string; sizes: StentSize[] };
export type LabStock = { balloonFamilies: StockFamily[]; stentPlatforms: StockPlatform[] };

export type SnapshotLookup = {
  kind: LookupKind;
  rows: number[];
  cols: number[];
  rounding: RoundingRule;
  /** The chart's balloon family id (absent in editions frozen before grids carried it). */
  familyId?: number;
  /** Only the in-stock sizes that can decide a cell of this grid; null when the family is gone. */
  family: BalloonFamilyStock | null;
  /** The caps marks are drawn against when the lab's are stricter than the chart's; absent: the snapshot's caps. */
  caps?: RoundingCaps;
  /** Reach lookups: the lab's headroom below rated burst pressure, atm (absent: DEFAULT_RBP_HEADROOM_ATM). */
  headroomAtm?: number;
};

/** What the lab's rules hold for one lookup kind that decides marks (LabRules["lookups"] fits). */
export type LookupLimits = { caps: RoundingCaps; rbpHeadroomAtm?: number };

/** The stricter of the chart's caps and the lab's: an exception excuses a wider cap, it never hides the mark. */
export function markingCaps(chart: RoundingCaps, lab: RoundingCaps | undefined): RoundingCaps {
  if (!lab) return { ...chart };
  return { upMm: Math.min(chart.upMm, lab.upMm), downMm: Math.min(chart.downMm, lab.downMm) };
}

/** Everything that decides a poster's printed numbers and texts, frozen into an edition. */
export type Snapshot = {
  format: 1;
  lab: { name: string };
  title: string;
  notes: string;
  paper: PaperId;
  orientation: Orientation;
  readingDistanceM: number;
  law: LawSpec;
  lookups: SnapshotLookup[];
  stent: { name: string; sizes: StentSize[] } | null;
  logoSha256: string | null;
  caution: string;
  /** Rounding caps; editions frozen before caps existed print with DEFAULT_ROUNDING_CAPS. */
  caps?: RoundingCaps;
  /** Exceptions to the lab's rules the medical lead recorded for this chart; the poster prints them. Absent when none. */
  ruleExceptions?: AppliedException[];
  /** The badge card's sides as the designer chose them (lib/poster/card.ts). Absent when not chosen. */
  card?: { sides: [CardSide, CardSide] };
};

/** A side with only the keys it sets, so an unset range never reaches the fingerprint. */
const cardSide = (side: CardSide): CardSide => ({
  lookup: side.lookup,
  ...(side.rows ? { rows: [side.rows[0], side.rows[1]] } : {}),
  ...(side.cols ? { cols: [side.cols[0], side.cols[1]] } : {}),
});

const round2 = (x: number) => Math.round(x * 100) / 100;

/**
 * The stocked sizes that can decide any cell whose exact targets lie in [min, max]: every size
 * in that span, plus the nearest size beyond each end (what `up`, `down` and `nearest` reach
 * for) and the sizes a `reach` pick could push up by its growth. A size outside this span
 * cannot change a printed cell, so its stock status must not make a poster stale.
 */
export function relevantDiameters(
  inStock: readonly number[],
  targets: readonly number[],
  growthMm: number | null,
): number[] {
  const sizes = [...new Set(inStock)].sort((a, b) => a - b);
  if (targets.length === 0 || sizes.length === 0) return [];
  const tol = STOCK_TOLERANCE_MM + 1e-9;
  const min = Math.min(...targets) - Math.max(0, growthMm ?? 0) - tol;
  const max = Math.max(...targets) + tol;
  const lo = sizes.filter((d) => d <= min).pop() ?? -Infinity;
  const hi = sizes.find((d) => d >= max) ?? Infinity;
  return sizes.filter((d) => d >= lo && d <= hi);
}

function exactTargets(lookup: ChartDefinition["lookups"][number], law: LawSpec): number[] {
  const grid = buildGrid({
    kind: lookup.kind,
    rows: lookup.rows,
    cols: lookup.cols,
    law,
    rounding: lookup.rounding,
    family: null,
  });
  return grid.cells.flat().flatMap((c) => (c.exact.ok ? [c.exact.diameterMm] : []));
}

/** Resolves a chart definition against the lab's stock today. Pure: same inputs, same snapshot. */
export function buildSnapshot(input: {
  labName: string;
  definition: ChartDefinition;
  stock: LabStock;
  logoSha256: string | null;
  /** Demo labs carry the "invented and illustrative" clause in their caution; real labs never do. */
  labIsDemo?: boolean;
  /** The exceptions that apply to this chart (lib/labs/rules.ts checkChartAgainstRules). */
  ruleExceptions?: AppliedException[];
  /** The lab's rules per lookup kind: marks are drawn against the lab's caps whatever the chart allows. */
  labLimits?: Readonly<Record<LookupKind, LookupLimits>>;
}): Snapshot {
  const { definition: def, stock } = input;
  const chartCaps = def.roundingCaps ?? DEFAULT_ROUNDING_CAPS;
  const lookups = def.lookups.map((l): SnapshotLookup => {
    const grid = buildGrid({
      kind: l.kind,
      rows: l.rows,
      cols: l.cols,
      law: def.law,
      rounding: l.rounding,
      family: null,
    });
    const fam = stock.balloonFamilies.find((f) => f.id === l.familyId);
    const family: BalloonFamilyStock | null = fam
      ? {
          name: fam.name,
          compliance: fam.compliance,
          nominalAtm: fam.nominalAtm,
          rbpAtm: fam.rbpAtm,
          growthAtRbpMm: fam.growthAtRbpMm,
          diameters: relevantDiameters(
            fam.balloons.filter((b) => b.inStock).map((b) => round2(b.diameterMm)),
            exactTargets(l, def.law),
            l.rounding === "reach" ? fam.growthAtRbpMm : null,
          ),
        }
      : null;
    const caps = markingCaps(chartCaps, input.labLimits?.[l.kind].caps);
    return {
      kind: l.kind,
      rows: grid.rowAxis.values,
      cols: grid.colAxis.values,
      rounding: l.rounding,
      familyId: l.familyId,
      family,
      // Only when stricter than the chart's, so charts within the lab's caps keep their fingerprints.
      ...(caps.upMm !== chartCaps.upMm || caps.downMm !== chartCaps.downMm ? { caps } : {}),
      ...(l.rounding === "reach"
        ? { headroomAtm: input.labLimits?.[l.kind].rbpHeadroomAtm ?? DEFAULT_RBP_HEADROOM_ATM }
        : {}),
    };
  });
  const platform = def.stentPlatformId ? stock.stentPlatforms.find((p) => p.id === def.stentPlatformId) : undefined;
  return {
    format: 1,
    lab: { name: input.labName },
    title: def.title,
    notes: def.notes,
    paper: def.paper,
    orientation: def.orientation,
    readingDistanceM: def.readingDistanceM,
    law: def.law,
    lookups,
    stent: platform
      ? {
          name: platform.name,
          sizes: [...platform.sizes]
            .map((s) => ({ nominalMm: round2(s.nominalMm), maxPostDilatationMm: round2(s.maxPostDilatationMm) }))
            .sort((a, b) => a.nominalMm - b.nominalMm),
        }
      : null,
    logoSha256: input.logoSha256,
    caution: cautionFor(input.labIsDemo === true),
    caps: { ...(def.roundingCaps ?? DEFAULT_ROUNDING_CAPS) },
    // Only when there are some, so charts without exceptions keep their fingerprints.
    ...(input.ruleExceptions?.length ? { ruleExceptions: input.ruleExceptions.map((e) => ({ ...e })) } : {}),
    // Likewise only when chosen: charts without a card choice keep their fingerprints.
    ...(def.card ? { card: { sides: [cardSide(def.card.sides[0]), cardSide(def.card.sides[1])] } } : {}),
  };
}

/** Why a snapshot cannot become an edition (empty when it can). */
export function snapshotProblems(snapshot: Snapshot, definition: ChartDefinition): string[] {
  const problems: string[] = [];
  snapshot.lookups.forEach((l, i) => {
    if (!l.family)
      problems.push(`Lookup ${i + 1} (${l.kind}) uses a balloon family that no longer exists: choose another.`);
  });
  if (definition.stentPlatformId && !snapshot.stent)
    problems.push("The chosen stent platform no longer exists: choose another or none.");
  return problems;
}

/** One lookup's grid as the snapshot prints it; `family` swaps in other diameters (what-if). */
export function lookupGrid(snapshot: Snapshot, l: Snapshot["lookups"][number], family = l.family): Grid {
  return buildGrid({
    kind: l.kind,
    rows: l.rows,
    cols: l.cols,
    law: snapshot.law,
    rounding: l.rounding,
    family,
    stent: l.kind === "proximal" && snapshot.stent ? snapshot.stent.sizes : null,
    caps: lookupCaps(snapshot, l),
    headroomAtm: l.headroomAtm ?? DEFAULT_RBP_HEADROOM_ATM,
  });
}

/** The caps a lookup's marks are drawn against. */
export const lookupCaps = (snapshot: Snapshot, l: SnapshotLookup): RoundingCaps =>
  l.caps ?? snapshot.caps ?? DEFAULT_ROUNDING_CAPS;

/** The grids a snapshot prints: the one grid model, never recomputed elsewhere. */
export function snapshotGrids(snapshot: Snapshot): Grid[] {
  return snapshot.lookups.map((l) => lookupGrid(snapshot, l));
}
