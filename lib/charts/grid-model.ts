// The one JSON shape of a chart's printed grids: the grid API answers it, and the poster and the
// designer preview draw the same cells (tests/unit/charts/grid-model.test.ts holds them equal).
import {
  buildGrid,
  cellMarks,
  formatExactMm,
  formatSizeMm,
  LAWS,
  lawName,
  roundDecimal,
  type Grid,
  type GridMark,
  type LawSpec,
  type LookupKind,
  type RoundingRule,
} from "@/lib/sizing";
import { snapshotGrids, type Snapshot } from "./snapshot";

export type GridCellJson = {
  exactMm: number | null;
  exactLabel: string | null;
  sizeMm: number | null;
  sizeLabel: string | null;
  atm: number | null;
  marks: GridMark[];
};

export type GridLookupJson = {
  kind: LookupKind;
  rounding: RoundingRule;
  familyId: number | null;
  rows: number[];
  cols: number[];
  outsideFitShare: number;
  cells: GridCellJson[][];
};

export type GridJson = { lookups: GridLookupJson[] };

/** Share of the cells with an exact size that lie outside the law's published fit (0..1, 4 places). */
export function outsideFitShare(grid: Grid): number {
  const sized = grid.cells.flat().filter((c) => c.exact.ok);
  if (sized.length === 0) return 0;
  return roundDecimal(sized.filter((c) => c.flags.outsideFit).length / sized.length, 4);
}

export function cellJson(cell: Grid["cells"][number][number]): GridCellJson {
  const exactMm = cell.exact.ok ? cell.exact.diameterMm : null;
  const pick = cell.balloon?.ok ? cell.balloon : null;
  return {
    exactMm,
    exactLabel: exactMm === null ? null : formatExactMm(exactMm),
    sizeMm: pick ? pick.diameterMm : null,
    sizeLabel: pick ? formatSizeMm(pick.diameterMm) : null,
    atm: pick ? pick.pressureAtm : null,
    marks: cellMarks(cell),
  };
}

/** The grids a snapshot prints, as the grid API answers them. Pure. */
export function gridJson(snapshot: Snapshot): GridJson {
  const grids = snapshotGrids(snapshot);
  return {
    lookups: grids.map((grid, i) => {
      const l = snapshot.lookups[i]!;
      return {
        kind: grid.kind,
        rounding: grid.rounding,
        familyId: l.familyId ?? null,
        rows: grid.rowAxis.values,
        cols: grid.colAxis.values,
        outsideFitShare: outsideFitShare(grid),
        cells: grid.cells.map((row) => row.map(cellJson)),
      };
    }),
  };
}

/** A chart is "mostly outside" its law's published fit above this share of sized cells. */
export const MOSTLY_OUTSIDE_SHARE = 0.5;

const FIT_LAWS: readonly LawSpec[] = [
  { law: "huo-kassab" },
  { law: "finet", ratio: 0.678 },
  { law: "murray" },
  { law: "square" },
];

export type FitAdvice = {
  lookupIndex: number;
  kind: LookupKind;
  share: number;
  /** The published law whose fit covers most of these diameters, with its share outside. */
  better: { law: LawSpec; name: string; share: number } | null;
  message: string;
};

const pct = (x: number) => `${Math.round(x * 100)} %`;

/**
 * For each lookup mostly outside its law's published fit (Huo et al. 2012, doi
 * 10.4244/EIJV7I11A206), the published law that fits the same grid's diameters best.
 */
export function fitAdvice(snapshot: Snapshot): FitAdvice[] {
  const out: FitAdvice[] = [];
  snapshotGrids(snapshot).forEach((grid, i) => {
    const share = outsideFitShare(grid);
    if (share <= MOSTLY_OUTSIDE_SHARE) return;
    const l = snapshot.lookups[i]!;
    let better: FitAdvice["better"] = null;
    for (const law of FIT_LAWS) {
      if (law.law === snapshot.law.law) continue;
      const other = buildGrid({ kind: l.kind, rows: l.rows, cols: l.cols, law, rounding: l.rounding, family: null });
      const s = outsideFitShare(other);
      if (s < share && (better === null || s < better.share)) better = { law, name: lawName(law), share: s };
    }
    const here = `${pct(share)} of the sized cells of the ${l.kind} lookup lie outside the published fit of ${lawName(snapshot.law)} (Huo et al. 2012), so its marks say little here.`;
    const advice = better
      ? ` For these diameters ${better.name} fits better (${pct(better.share)} outside; ${LAWS[better.law.law].source}).`
      : "";
    out.push({ lookupIndex: i, kind: l.kind, share, better, message: here + advice });
  });
  return out;
}

/**
 * A chart's live grid: its live snapshot, with family ids taken from the definition where the
 * snapshot predates them.
 */
export function liveGridJson(live: Snapshot, definition: { lookups: readonly { familyId: number }[] }): GridJson {
  const withIds: Snapshot = {
    ...live,
    lookups: live.lookups.map((l, i) => ({ ...l, familyId: l.familyId ?? definition.lookups[i]?.familyId })),
  };
  return gridJson(withIds);
}
