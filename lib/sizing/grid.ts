import { resolveAxis, type AxisInput } from "./axis";
import { formatExactMm } from "./format";
import { lawFit } from "./fit";
import { lawSpecProblem, solve, type KnownDiameters, type LawSpec, type Vessel } from "./laws";
import {
  balloonDiameterAt,
  hasGrowthData,
  pickBalloon,
  type BalloonFamilyStock,
  type BalloonPick,
  type LookupKind,
  type RoundingRule,
} from "./rounding";
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
  /** How far a printed size may differ from its exact target; DEFAULT_ROUNDING_CAPS when absent. */
  caps?: RoundingCaps;
  /** A reach pressure this close below rated burst pressure is marked; DEFAULT_RBP_HEADROOM_ATM when absent. */
  headroomAtm?: number;
};

/** Reach pressures within this many atm below rated burst pressure are marked (common practice; no published source). */
export const DEFAULT_RBP_HEADROOM_ATM = 1;

export type RoundingCaps = { upMm: number; downMm: number };

/**
 * Default rounding caps: a printed balloon at most 0.25 mm above or 0.5 mm below its exact
 * target without a mark (common practice; no published source). The lab may set its own.
 */
export const DEFAULT_ROUNDING_CAPS: Readonly<RoundingCaps> = { upMm: 0.25, downMm: 0.5 };

const CAP_SLACK_MM = 1e-9;

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
  flags: { hazard: boolean; outsideFit: boolean; oversize: boolean; undersize: boolean; nearRbp?: boolean };
  hazardDetail?: string;
  /** The reach pressure and how close it is to rated burst pressure, when marked. */
  rbpDetail?: string;
  /** Printed size minus exact target, mm, when the cap is exceeded. */
  capDetail?: string;
  fitNote?: string;
};

export type Grid = {
  kind: LookupKind;
  solved: Vessel;
  rowAxis: GridAxis;
  colAxis: GridAxis;
  law: LawSpec;
  rounding: RoundingRule;
  caps: RoundingCaps;
  headroomAtm: number;
  /** Proximal grids with a platform: the balloon diameter the stent limit was checked at. */
  stentCheck: "rbp" | "nominal" | null;
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
  const caps = input.caps ?? DEFAULT_ROUNDING_CAPS;
  const headroomAtm = input.headroomAtm ?? DEFAULT_RBP_HEADROOM_ATM;
  const family = input.family;
  const growth = family !== null && hasGrowthData(family);

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
          flags: { hazard: false, outsideFit: false, oversize: false, undersize: false },
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
        flags: { hazard: false, outsideFit: !fit.withinPublishedFit, oversize: false, undersize: false },
      };
      if (!fit.withinPublishedFit) cell.fitNote = fit.note;
      if (balloon?.ok) {
        // What the operator gets: the nominal size, or the stated reach pressure's diameter.
        const delivered = balloon.pressureAtm === null ? balloon.diameterMm : balloon.expectedMm;
        const off = delivered - exact;
        if (off > caps.upMm + CAP_SLACK_MM) {
          cell.flags.oversize = true;
          cell.capDetail = `${formatExactMm(delivered)} mm is ${formatExactMm(off)} mm above the exact ${formatExactMm(exact)} mm (cap ${caps.upMm} mm)`;
        } else if (-off > caps.downMm + CAP_SLACK_MM) {
          cell.flags.undersize = true;
          cell.capDetail = `${formatExactMm(delivered)} mm is ${formatExactMm(-off)} mm below the exact ${formatExactMm(exact)} mm (cap ${caps.downMm} mm)`;
        }
        if (
          family &&
          balloon.pressureAtm !== null &&
          family.rbpAtm - balloon.pressureAtm <= headroomAtm + CAP_SLACK_MM
        ) {
          cell.flags.nearRbp = true;
          cell.rbpDetail = `${balloon.pressureAtm} atm is within ${headroomAtm} atm of the rated burst pressure (${family.rbpAtm} atm)`;
        }
      }
      if (platform) {
        // Checked at the highest pressure the cell allows: rated burst pressure, by the family's
        // growth (a reach cell's stated pressure is lower, so this also covers it). Without
        // growth data the balloon is checked at its nominal diameter.
        const atRbp =
          balloon?.ok && family
            ? growth
              ? balloonDiameterAt(family, balloon.diameterMm, family.rbpAtm)
              : balloon.diameterMm
            : exact;
        const at = balloon?.ok && family ? (growth ? ` at RBP ${family.rbpAtm} atm` : " at nominal") : "";
        const check = checkPot(atRbp, full.mb, platform, at);
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
    caps: { ...caps },
    headroomAtm,
    stentCheck: platform ? (growth ? "rbp" : "nominal") : null,
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
  oversize: number;
  undersize: number;
  nearRbp: number;
};

/** Counts for legends. */
export function gridSummary(grid: Grid): GridSummary {
  const s: GridSummary = {
    cells: 0,
    sized: 0,
    noSize: 0,
    noStock: 0,
    hazard: 0,
    outsideFit: 0,
    oversize: 0,
    undersize: 0,
    nearRbp: 0,
  };
  for (const cell of grid.cells.flat()) {
    s.cells++;
    if (!cell.exact.ok) s.noSize++;
    else if (cell.balloon && !cell.balloon.ok) s.noStock++;
    else s.sized++;
    if (cell.flags.hazard) s.hazard++;
    if (cell.flags.outsideFit) s.outsideFit++;
    if (cell.flags.oversize) s.oversize++;
    if (cell.flags.undersize) s.undersize++;
    if (cell.flags.nearRbp) s.nearRbp++;
  }
  return s;
}

/** The marks a cell can carry, by their API names (grid API, poster, preview and tests share them). */
export const GRID_MARKS = [
  "not-bifurcation",
  "below-stock",
  "above-stock",
  "stent-limit",
  "oversize",
  "undersize",
  "outside-fit",
  "near-rbp",
] as const;
export type GridMark = (typeof GRID_MARKS)[number];

/**
 * A cell's marks in GRID_MARKS order. A family with nothing in stock covers no target at either
 * end, so such a cell carries both `below-stock` and `above-stock`.
 */
export function cellMarks(cell: Cell): GridMark[] {
  if (!cell.exact.ok) return ["not-bifurcation"];
  const marks: GridMark[] = [];
  const pick = cell.balloon;
  if (pick && !pick.ok) {
    if (pick.code === "below_stock" || pick.code === "no_stock") marks.push("below-stock");
    if (pick.code === "above_stock" || pick.code === "no_stock") marks.push("above-stock");
  }
  if (cell.flags.hazard) marks.push("stent-limit");
  if (cell.flags.oversize) marks.push("oversize");
  if (cell.flags.undersize) marks.push("undersize");
  if (cell.flags.outsideFit) marks.push("outside-fit");
  if (cell.flags.nearRbp) marks.push("near-rbp");
  return marks;
}
