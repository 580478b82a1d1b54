import type { CSSProperties } from "react";
import { GridHeadRow, posterCellStyle } from "@/components/poster/grid-head";
import { axisTitles, gridSubtitle, lookupTitle } from "@/lib/poster/labels";
import { cellView, cornerSymbols, formatAxisMm, PALETTE } from "@/lib/poster/marks";
import type { BalloonFamilyStock, Grid } from "@/lib/sizing";

const heading: CSSProperties = { backgroundColor: PALETTE.heading, borderColor: PALETTE.rule };

/**
 * One printed grid for reading on a phone or a wall screen: large cells, the column headings
 * stick to the top and the row headings to the left while the grid scrolls inside its box.
 * The cells are the poster's (lib/poster/marks cellView); no client JavaScript.
 */
export function WallGrid({
  grid,
  family,
  stentName,
}: {
  grid: Grid;
  family: BalloonFamilyStock | null;
  stentName: string | null;
}) {
  const titles = axisTitles(grid);
  return (
    <section className="space-y-2" aria-label={lookupTitle(grid.kind)}>
      <h2 className="text-lg font-bold">{lookupTitle(grid.kind)}</h2>
      <p className="text-sm text-ink-soft">
        {gridSubtitle({ kind: grid.kind, rounding: grid.rounding, family }, stentName)}
      </p>
      <p className="text-sm text-ink-soft">
        Rows: {titles.rows}; columns: {titles.cols}
      </p>
      <div
        className="max-h-[75vh] max-w-full overflow-auto rounded-md border border-line"
        data-testid="wall-scroll"
        tabIndex={0}
        role="region"
        aria-label={`${lookupTitle(grid.kind)}, scrollable`}
      >
        <table className="border-separate border-spacing-0 text-center tabular-nums" data-testid="wall-grid">
          <thead>
            <GridHeadRow
              grid={grid}
              titles={titles}
              cornerClassName="sticky left-0 top-0 z-20 border-b border-r px-2 py-1 text-xs font-semibold leading-tight"
              colClassName="sticky top-0 z-10 border-b border-r px-2 py-2 text-lg font-bold"
            />
          </thead>
          <tbody>
            {grid.cells.map((row, i) => (
              <tr key={grid.rowAxis.values[i]}>
                <th
                  scope="row"
                  className="sticky left-0 z-10 border-b border-r px-3 py-2 text-lg font-bold"
                  style={heading}
                >
                  {formatAxisMm(grid.rowAxis.values[i] as number)}
                </th>
                {row.map((cell) => {
                  const view = cellView(cell);
                  const corner = cornerSymbols(view);
                  return (
                    <td
                      key={cell.col}
                      title={view.description}
                      data-marks={view.marks.join(" ") || undefined}
                      className="relative min-w-[5.5rem] border-b border-r px-2 pb-2 pt-5 align-bottom"
                      style={posterCellStyle(view)}
                    >
                      <span aria-hidden="true">
                        {view.exact ? <span className="absolute left-1.5 top-1 text-xs">{view.exact}</span> : null}
                        {corner ? <span className="absolute right-1.5 top-1 text-sm font-bold">{corner}</span> : null}
                        <span className="block text-3xl font-bold leading-none">{view.primary}</span>
                        {grid.rounding === "reach" && view.pressure ? (
                          <span className="block text-sm font-semibold">{view.pressure}</span>
                        ) : null}
                      </span>
                      <span className="sr-only">{view.description}</span>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
