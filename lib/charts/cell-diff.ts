// Which printed cells of a posted copy differ from another snapshot (the replacement edition, or
// the chart as it resolves today), in words for the check page. The comparison is the diff API's
// (lib/editions/diff.ts): one notion of "prints something else" for approvers and operators.
import { diffCells as diffPrinted, type PrintedCell } from "@/lib/editions/diff";
import { formatAxisMm } from "@/lib/poster/marks";
import type { GridMark, LookupKind, Vessel } from "@/lib/sizing";
import { lookupGrid, type Snapshot } from "./snapshot";

export type CellText = { text: string; marks: GridMark[] };

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
export function cellText(cell: PrintedCell): CellText {
  let text: string;
  if (cell.marks.includes("not-bifurcation")) text = "no size (not a bifurcation)";
  else if (cell.marks.includes("below-stock") || cell.marks.includes("above-stock"))
    text = `no stocked size${cell.exact ? ` (exact ${cell.exact} mm)` : ""}`;
  else text = `${cell.printed} mm${cell.pressure ? ` ${cell.pressure}` : ""}`;
  return { text, marks: cell.marks };
}

const MARK_WORDS: Readonly<Record<GridMark, string>> = {
  "not-bifurcation": "no size",
  "below-stock": "below stock",
  "above-stock": "above stock",
  "stent-limit": "stent limit",
  oversize: "above the rounding cap",
  undersize: "below the rounding cap",
  "outside-fit": "outside published fit",
  "near-rbp": "near rated burst pressure",
};

/** The cell with its small print (exact diameter, marks) spelled out: for two cells whose large figure is the same. */
function fullText(cell: PrintedCell, base: CellText): CellText {
  const extra = [
    cell.exact && !base.text.includes(`exact ${cell.exact}`) ? `exact ${cell.exact} mm` : null,
    ...cell.marks.filter((m) => m !== "not-bifurcation").map((m) => MARK_WORDS[m]),
  ].filter(Boolean);
  return extra.length ? { text: `${base.text} (${extra.join(", ")})`, marks: base.marks } : base;
}

/** Both sides in words; the small print is added only where the large print alone reads the same. */
function sideTexts(after: PrintedCell, before: PrintedCell | null): { printed: CellText; other: CellText | null } {
  const printed = cellText(after);
  const other = before ? cellText(before) : null;
  if (!before || !other || other.text !== printed.text) return { printed, other };
  return { printed: fullText(after, printed), other: fullText(before, other) };
}

const VESSEL_WORDS: Readonly<Record<Vessel, string>> = { parent: "Parent", mb: "Main branch", sb: "Side branch" };

/**
 * Every cell `printed` prints whose content (size, pressure, exact diameter, marks) differs in
 * `other`, in print order. With `other` null every printed cell counts as affected. Pure.
 */
export function diffCells(printed: Snapshot, other: Snapshot | null): CellDiff[] {
  const lookups = new Map(
    printed.lookups.map((l, i) => {
      const grid = lookupGrid(printed, l);
      return [l.kind, { index: i, rowVessel: grid.rowAxis.vessel, colVessel: grid.colAxis.vessel }] as const;
    }),
  );
  return diffPrinted(other, printed).flatMap((d) => {
    const l = lookups.get(d.lookup);
    if (!d.after || !l) return [];
    const texts = sideTexts(d.after, d.before);
    // Only what a reader can see differ is listed.
    if (texts.other && texts.other.text === texts.printed.text) return [];
    return [
      {
        lookupIndex: l.index,
        kind: d.lookup,
        rowVessel: l.rowVessel,
        colVessel: l.colVessel,
        row: d.row,
        col: d.col,
        where: `${VESSEL_WORDS[l.rowVessel]} ${formatAxisMm(d.row)} mm × ${VESSEL_WORDS[l.colVessel].toLowerCase()} ${formatAxisMm(d.col)} mm`,
        ...texts,
      },
    ];
  });
}
