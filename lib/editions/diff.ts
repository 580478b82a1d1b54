// What an approver must look at: the printed cells that differ between an edition and the one it
// would replace. Cells come from the one grid model (lookupGrid) and print as the poster does (cellView).
import { lookupGrid, type Snapshot } from "@/lib/charts/snapshot";
import { cellView } from "@/lib/poster/marks";
import { cellMarks, type GridMark, type LookupKind } from "@/lib/sizing";

/** What the poster prints in one cell, as the diff API answers it. */
export type PrintedCell = {
  /** The large figure: the stocked balloon in mm, the exact diameter (no family), or a mark's symbol. */
  printed: string;
  /** "@ 16 atm" when the balloon is pushed above nominal pressure (reach grids); else null. */
  pressure: string | null;
  /** The exact diameter printed small in the cell, in mm, or null when none is printed. */
  exact: string | null;
  /** The cell's marks, named as in the grid API (GRID_MARKS order). */
  marks: GridMark[];
  /** The whole cell in words (what a screen reader hears); not compared: the poster prints the fields above. */
  text: string;
};

export type DiffCell = {
  lookup: LookupKind;
  /** Row and column axis values, in mm. */
  row: number;
  col: number;
  /** null when the cell is not printed on that side (new or removed axis value, lookup or edition). */
  before: PrintedCell | null;
  after: PrintedCell | null;
};

type Printed = Map<string, { lookup: LookupKind; row: number; col: number; cell: PrintedCell }>;

const key = (lookup: LookupKind, row: number, col: number) => `${lookup}|${row}|${col}`;

/** Every printed cell of a snapshot, keyed by lookup kind, row and column, in print order. */
export function printedCells(snapshot: Snapshot): Printed {
  const out: Printed = new Map();
  for (const l of snapshot.lookups) {
    const grid = lookupGrid(snapshot, l);
    grid.cells.forEach((cells, i) =>
      cells.forEach((cell, j) => {
        const row = grid.rowAxis.values[i]!;
        const col = grid.colAxis.values[j]!;
        const view = cellView(cell);
        out.set(key(l.kind, row, col), {
          lookup: l.kind,
          row,
          col,
          cell: {
            printed: view.primary,
            pressure: grid.rounding === "reach" ? view.pressure : null,
            exact: view.exact === null ? null : view.exact.replace(/^\(|\)$/g, ""),
            marks: cellMarks(cell),
            text: view.description,
          },
        });
      }),
    );
  }
  return out;
}

const samePrint = (a: PrintedCell, b: PrintedCell) =>
  a.printed === b.printed &&
  a.pressure === b.pressure &&
  a.exact === b.exact &&
  a.marks.length === b.marks.length &&
  a.marks.every((m, i) => m === b.marks[i]);

/**
 * The cells whose print differs, `after`'s cells first in print order, then cells only `before`
 * printed. With no `before` edition every cell of `after` is listed with before null. Pure.
 */
export function diffCells(before: Snapshot | null, after: Snapshot): DiffCell[] {
  const a = printedCells(after);
  const b = before ? printedCells(before) : (new Map() as Printed);
  const out: DiffCell[] = [];
  for (const [k, v] of a) {
    const old = b.get(k);
    if (old && samePrint(old.cell, v.cell)) continue;
    out.push({ lookup: v.lookup, row: v.row, col: v.col, before: old?.cell ?? null, after: v.cell });
  }
  for (const [k, v] of b) {
    if (!a.has(k)) out.push({ lookup: v.lookup, row: v.row, col: v.col, before: v.cell, after: null });
  }
  return out;
}

export type EditionDiff = { against: number | null; cells: DiffCell[] };
