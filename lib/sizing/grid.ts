import { resolveAxis, type AxisInput } from "./axis";
import { lawFit } from "./fit";
import { lawSpecProblem, solve, type KnownDiameters, type LawSpec, type Vessel } from "./laws";
import { pickBalloon, type BalloonFamilyStock, type BalloonPick, type LookupKind, type RoundingRule } from "./rounding";
import { checkPot, type StentSize } from "./stent";

export type GridInput = {
  kind: LookupKind;
  rows: AxisInput;
  cols: AxisInput;
  law: LawSpec;
  rounding: RoundingRule;
  family: BalloonFamilyStock | null;
  /** Main-branch stent platform; only proximal lookups use it. Empty or null: no hazard check. */
  stent?: readonly StentSize[] | null;
};

export type GridAxis = { vessel: Vessel; label: string; values: number[] };

export type CellExact = { ok: true; diameterMm: number } | { ok: false; reason: string };

export type Cell = {
  /** Row axis value, mm. */
  row: number;
  /** Column axis value, mm. */
  col: number;
  exact: CellExact;
  /** null when the cell has no exact size or the chart has no balloon family. */
  balloon: BalloonPick | null;
  flags: { hazard: boolean; outsideFit: boolean };
  hazardDetail?: string;
  fitNote?: string;
};

export type Grid = {
  kind: LookupKind;
  solved: Vessel;
  rowAxis: GridAxis;
  colAxis: GridAxis;
  law: LawSpec;
  rounding: RoundingRule;
  cells: Cell[][];
};

/** Which diameter each lookup reads on its rows and columns, and which it solves. */
export const LOOKUP_VESSELS: Readonly<Record<LookupKind, { rows: Vessel; cols: Vessel; solved: Vessel }>> = {
  proximal: { rows: "mb", cols: "sb", solved: "parent" },
  side: { rows: "parent", cols: "mb", solved: "sb" },
  main: { rows: "parent", cols: "sb", solved: "mb" },
};

export const VESSEL_LABELS: Readonly<Record<Vessel, string>> = {
  parent: "Parent (proximal main vessel), mm",
  mb: "Main branch, mm",
  sb: "Side branch, mm",
};

/** Thrown for unusable grid input (bad axis or law bounds); validate before building. */
export class GridInputError extends Error {
  override name = "GridInputError";
}

/** The one place chart sizes are computed: posters, preview and calculator all read this. */
export function buildGrid(input: GridInput): Grid {
  const lawProblem = lawSpecProblem(input.law);
  if (lawProblem) throw new GridInputError(lawProblem);
  const vessels = LOOKUP_VESSELS[input.kind];
  if (!vessels) throw new GridInputError("Unknown lookup kind");
  const rows = resolveAxis(input.rows);
  if (!rows.ok) throw new GridInputError(`Rows: ${rows.reason}`);
  const cols = resolveAxis(input.cols);
  if (!cols.ok) throw new GridInputError(`Columns: ${cols.reason}`);

  const platform = input.kind === "proximal" && input.stent && input.stent.length > 0 ? input.stent : null;

  const cells = rows.values.map((row) =>
    cols.values.map((col): Cell => {
      const known: KnownDiameters = { [vessels.rows]: row, [vessels.cols]: col };
      const result = solve(input.law, known);
      if (!result.ok) {
        return {
          row,
          col,
          exact: { ok: false, reason: result.reason },
          balloon: null,
          flags: { hazard: false, outsideFit: false },
        };
      }
      const exact = result.diameterMm;
      const full = { ...known, [vessels.solved]: exact } as Required<KnownDiameters>;
      const balloon = input.family ? pickBalloon(exact, input.family, input.rounding) : null;
      const fit = lawFit(input.law, full.mb, full.sb);
      const cell: Cell = {
        row,
        col,
        exact: { ok: true, diameterMm: exact },
        balloon,
        flags: { hazard: false, outsideFit: !fit.withinPublishedFit },
      };
      if (!fit.withinPublishedFit) cell.fitNote = fit.note;
      if (platform) {
        const pot = balloon?.ok ? Math.max(balloon.diameterMm, balloon.expectedMm) : exact;
        const check = checkPot(pot, full.mb, platform);
        cell.flags.hazard = check.hazard;
        if (check.detail) cell.hazardDetail = check.detail;
      }
      return cell;
    }),
  );

  return {
    kind: input.kind,
    solved: vessels.solved,
    rowAxis: { vessel: vessels.rows, label: VESSEL_LABELS[vessels.rows], values: rows.values },
    colAxis: { vessel: vessels.cols, label: VESSEL_LABELS[vessels.cols], values: cols.values },
    law: { ...input.law },
    rounding: input.rounding,
    cells,
  };
}

export type GridSummary = {
  cells: number;
  /** Cells with a balloon (or, without a family, an exact size). */
  sized: number;
  noSize: number;
  noStock: number;
  hazard: number;
  outsideFit: number;
};

/** Counts for legends. */
export function gridSummary(grid: Grid): GridSummary {
  const s: GridSummary = { cells: 0, sized: 0, noSize: 0, noStock: 0, hazard: 0, outsideFit: 0 };
  for (const cell of grid.cells.flat()) {
    s.cells++;
    if (!cell.exact.ok) s.noSize++;
    else if (cell.balloon && !cell.balloon.ok) s.noStock++;
    else s.sized++;
    if (cell.flags.hazard) s.hazard++;
    if (cell.flags.outsideFit) s.outsideFit++;
  }
  return s;
}
