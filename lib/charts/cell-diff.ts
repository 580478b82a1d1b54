// Which printed cells differ between two frozen snapshots (a posted copy and another edition,
// or the chart as it resolves today): the check page names them so nobody hunts for the change.
import { formatAxisMm, cellView, type CellView } from "@/lib/poster/marks";
import type { Grid, LookupKind, Vessel } from "@/lib/sizing";
import { lookupGrid, type Snapshot } from "./snapshot";

export type CellText = { text: string; marks: CellView["marks"] };

export type CellDiff = {
  lookupIndex: number;
  kind: LookupKind;
  rowVessel: Vessel;
  colVessel: Vessel;
  row: number;
  col: number;
  /** "Main branch 3.5 mm × side branch 2.5 mm". */
  where: string;
  /** What the copy prints in that cell. */
  printed: CellText;
  /** What the other snapshot prints there; null when it has no such cell (or no snapshot). */
  other: CellText | null;
};

/** A cell as a person reads it off the poster: the size with its pressure, or the mark's meaning. */
export function cellText(view: CellView): CellText {
  let text: string;
  if (view.marks.includes("noSize")) text = "no size (not a bifurcation)";
  else if (view.marks.includes("noStock")) text = `no stocked size ${view.exact ?? ""}`.trim();
  else text = `${view.primary} mm${view.pressure ? ` ${view.pressure}` : ""}`;
  return { text, marks: view.marks };
}

const VESSEL_WORDS: Readonly<Record<Vessel, string>> = { parent: "Parent", mb: "Main branch", sb: "Side branch" };

const same = (a: CellView, b: CellView) =>
  a.primary === b.primary && a.pressure === b.pressure && a.exact === b.exact && a.marks.join() === b.marks.join();

function matchLookup(other: Snapshot, kind: LookupKind, index: number) {
  const byIndex = other.lookups[index];
  if (byIndex?.kind === kind) return byIndex;
  return other.lookups.find((l) => l.kind === kind) ?? null;
}

function cellAt(grid: Grid, row: number, col: number) {
  const r = grid.rowAxis.values.findIndex((v) => Math.abs(v - row) < 1e-9);
  const c = grid.colAxis.values.findIndex((v) => Math.abs(v - col) < 1e-9);
  return r < 0 || c < 0 ? null : (grid.cells[r]?.[c] ?? null);
}

/**
 * Every cell of `printed` whose printed content (size, pressure, exact diameter, marks) differs in
 * `other`, computed from the grid model (lookupGrid), in print order. With `other` null every
 * printed cell counts as affected. Pure.
 */
export function diffCells(printed: Snapshot, other: Snapshot | null): CellDiff[] {
  const out: CellDiff[] = [];
  printed.lookups.forEach((l, i) => {
    const grid = lookupGrid(printed, l);
    const otherLookup = other ? matchLookup(other, l.kind, i) : null;
    const otherGrid = other && otherLookup ? lookupGrid(other, otherLookup) : null;
    for (const row of grid.cells)
      for (const cell of row) {
        const view = cellView(cell);
        const there = otherGrid ? cellAt(otherGrid, cell.row, cell.col) : null;
        const otherView = there ? cellView(there) : null;
        if (otherView && same(view, otherView)) continue;
        out.push({
          lookupIndex: i,
          kind: l.kind,
          rowVessel: grid.rowAxis.vessel,
          colVessel: grid.colAxis.vessel,
          row: cell.row,
          col: cell.col,
          where: `${VESSEL_WORDS[grid.rowAxis.vessel]} ${formatAxisMm(cell.row)} mm × ${VESSEL_WORDS[grid.colAxis.vessel].toLowerCase()} ${formatAxisMm(cell.col)} mm`,
          printed: cellText(view),
          other: otherView ? cellText(otherView) : null,
        });
      }
  });
  return out;
}
