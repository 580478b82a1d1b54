import type { CSSProperties } from "react";
import { GridHeadRow, posterCellStyle } from "@/components/poster/grid-head";
import type { DiffCell } from "@/lib/editions/diff";
import { axisTitles, lookupTitle } from "@/lib/poster/labels";
import { cellView, cornerSymbols, formatAxisMm, PALETTE } from "@/lib/poster/marks";
import type { Grid, GridMark } from "@/lib/sizing";

export const cellKey = (row: number, col: number) => `${row}|${col}`;

// A changed cell carries a heavy dashed outline and a ◆ (explained above the grids, and "Changed." for
// screen readers): never colour alone.
const CHANGED: CSSProperties = { outline: `3px dashed ${PALETTE.ink}`, outlineOffset: "-3px" };

/**
 * One lookup's grid as the poster prints it, with the cells that differ from the other edition
 * outlined and labelled. No client JavaScript; every cell is also in words for screen readers.
 */
export function DiffGrid({ grid, changed, side }: { grid: Grid; changed: Set<string>; side: "before" | "after" }) {
  const titles = axisTitles(grid);
  return (
    <div className="min-w-0" data-testid={`diff-grid-${side}-${grid.kind}`}>
      {/* The title wraps at the screen's width; only the table scrolls sideways. */}
      <p className="mb-2 break-words text-left text-sm" aria-hidden>
        <span className="block font-bold">{lookupTitle(grid.kind)}</span>
        <span className="block text-xs text-ink-soft">
          Rows: {titles.rows}; columns: {titles.cols}
        </span>
      </p>
      <div className="overflow-x-auto">
        <table className="border-collapse text-center tabular-nums" style={{ color: PALETTE.ink }}>
          <caption className="sr-only">
            {lookupTitle(grid.kind)}. Rows: {titles.rows}; columns: {titles.cols}
          </caption>
          <thead>
            <GridHeadRow
              grid={grid}
              titles={titles}
              cornerClassName="border px-1 py-1 text-[0.6rem] font-semibold leading-tight"
              colClassName="border px-1 py-1 text-xs font-bold"
            />
          </thead>
          <tbody>
            {grid.cells.map((row, i) => {
              const r = grid.rowAxis.values[i] as number;
              return (
                <tr key={r}>
                  <th
                    scope="row"
                    className="border px-1 py-1 text-xs font-bold"
                    style={{ backgroundColor: PALETTE.heading, borderColor: PALETTE.rule }}
                  >
                    {formatAxisMm(r)}
                  </th>
                  {row.map((cell, j) => {
                    const c = grid.colAxis.values[j] as number;
                    const view = cellView(cell);
                    const isChanged = changed.has(cellKey(r, c));
                    const corner = cornerSymbols(view);
                    return (
                      <td
                        key={c}
                        title={view.description}
                        data-changed={isChanged ? "true" : undefined}
                        className="relative min-w-14 border px-1 pb-1 pt-0.5 align-bottom"
                        style={isChanged ? { ...posterCellStyle(view), ...CHANGED } : posterCellStyle(view)}
                      >
                        <span aria-hidden="true">
                          <span className="flex min-h-4 justify-between gap-1 text-[0.65rem] font-bold leading-4">
                            <span>{isChanged ? "◆" : ""}</span>
                            <span>{corner}</span>
                          </span>
                          <span className="block text-lg font-bold leading-none">{view.primary}</span>
                          {grid.rounding === "reach" && view.pressure ? (
                            <span className="block text-[0.6rem] font-semibold">{view.pressure}</span>
                          ) : null}
                        </span>
                        <span className="sr-only">
                          {isChanged ? "Changed. " : ""}
                          {view.description}
                        </span>
                      </td>
                    );
                  })}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}

/** Each mark in the words of the poster's legend, not its API name. */
const MARK_WORDS: Readonly<Record<GridMark, string>> = {
  "not-bifurcation": "no size: not a bifurcation",
  "below-stock": "no stocked size (below the smallest)",
  "above-stock": "no stocked size (above the largest)",
  "stent-limit": "stent limit",
  oversize: "above the rounding cap",
  undersize: "below the rounding cap",
  "outside-fit": "outside the law's published fit",
  "near-rbp": "near rated burst pressure",
};

/** A changed cell's print in a few words: the figure, its pressure and its marks. */
export function printedWords(p: DiffCell["before"]): string {
  if (!p) return "not printed";
  const parts = [p.printed];
  if (p.pressure) parts.push(p.pressure);
  if (p.exact && p.exact !== p.printed) parts.push(`(exact ${p.exact})`);
  if (p.marks.length) parts.push(`(${p.marks.map((m) => MARK_WORDS[m]).join("; ")})`);
  return parts.join(" ");
}
