import { GridHeadRow, posterCellStyle } from "@/components/poster/grid-head";
import { Caution } from "@/components/ui/caution";
import type { BalloonFamilyStock, Grid } from "@/lib/sizing";
import { axisTitles, gridSubtitle, lookupTitle } from "@/lib/poster/labels";
import {
  cellView,
  CORNER_MARKS,
  cornerSymbols,
  formatAxisMm,
  legendEntries,
  MARKS,
  PALETTE,
  type MarkId,
} from "@/lib/poster/marks";

function Swatch({ mark }: { mark: MarkId | "sized" }) {
  const def = mark === "sized" ? null : MARKS[mark];
  const primary = mark === "sized" ? "3.0" : mark === "noStock" ? "▲" : mark === "noSize" ? "—" : "3.5";
  const corner = mark !== "sized" && CORNER_MARKS.includes(mark) ? MARKS[mark].symbol : "";
  return (
    <span
      aria-hidden="true"
      className="relative inline-flex h-10 w-16 shrink-0 items-end justify-center border pb-0.5 text-lg font-bold tabular-nums"
      style={{
        ...posterCellStyle({
          background: def?.background ?? PALETTE.cell,
          hatch: def?.hatch ?? false,
          border: def?.border ?? 0,
        }),
        borderColor: PALETTE.rule,
      }}
    >
      {mark !== "noSize" ? <span className="absolute left-1 top-0.5 text-[0.6rem] font-normal">(3.42)</span> : null}
      {corner ? <span className="absolute right-1 top-0.5 text-[0.65rem]">{corner}</span> : null}
      {primary}
    </span>
  );
}

export type GridPreviewProps = {
  grid: Grid;
  /** The balloon family the grid was built with (for the subtitle); null when it has none. */
  family: BalloonFamilyStock | null;
  /** The stent platform checked on POT grids, or null. */
  stentName: string | null;
  legend?: boolean;
  caution?: boolean;
};

/**
 * A grid as an HTML table with the poster's marks, symbols, colours and legend: the designer's
 * live preview and the calculator. No client JavaScript; every mark is also in words.
 */
export function GridPreview({ grid, family, stentName, legend = true, caution = true }: GridPreviewProps) {
  const titles = axisTitles(grid);
  const pressureLine = grid.rounding === "reach";
  const entries = legendEntries({
    law: grid.law,
    stentName,
    hasProximal: grid.kind === "proximal",
    hasReach: pressureLine,
    caps: grid.caps,
    headroomAtm: grid.headroomAtm,
  });
  return (
    <figure className="space-y-4">
      <div className="overflow-x-auto">
        <table className="border-collapse text-center tabular-nums" style={{ color: PALETTE.ink }}>
          <caption className="mb-2 text-left">
            <span className="block text-base font-bold">{lookupTitle(grid.kind)}</span>
            <span className="block text-xs text-ink-soft">
              {gridSubtitle({ kind: grid.kind, rounding: grid.rounding, family }, stentName)}
            </span>
            <span className="block text-xs text-ink-soft">
              Rows: {titles.rows}; columns: {titles.cols}
            </span>
          </caption>
          <thead>
            <GridHeadRow
              grid={grid}
              titles={titles}
              cornerClassName="border px-2 py-1 text-[0.65rem] font-semibold leading-tight"
              colClassName="border px-2 py-1 text-sm font-bold"
            />
          </thead>
          <tbody>
            {grid.cells.map((row, i) => (
              <tr key={grid.rowAxis.values[i]}>
                <th
                  scope="row"
                  className="border px-2 py-1 text-sm font-bold"
                  style={{ backgroundColor: PALETTE.heading, borderColor: PALETTE.rule }}
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
                      className="relative min-w-16 border px-1 pb-1 pt-3.5 align-bottom"
                      style={posterCellStyle(view)}
                    >
                      <span aria-hidden="true">
                        {view.exact ? (
                          <span className="absolute left-1 top-0.5 text-[0.65rem]">{view.exact}</span>
                        ) : null}
                        {corner ? (
                          <span className="absolute right-1 top-0.5 text-[0.7rem] font-bold">{corner}</span>
                        ) : null}
                        <span className="block text-xl font-bold leading-none">{view.primary}</span>
                        {pressureLine && view.pressure ? (
                          <span className="block text-[0.65rem] font-semibold">{view.pressure}</span>
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
      {legend ? (
        <figcaption>
          <h3 className="text-sm font-bold">How to read a cell</h3>
          <ul className="mt-2 grid gap-2 text-xs sm:grid-cols-2">
            {entries.map((e) => (
              <li key={e.mark} className="flex items-start gap-2">
                <Swatch mark={e.mark} />
                <span>
                  <strong>{e.label}.</strong> {e.text}
                </span>
              </li>
            ))}
          </ul>
        </figcaption>
      ) : null}
      {caution ? <Caution /> : null}
    </figure>
  );
}
