import type { CSSProperties } from "react";
import { VESSEL_SYMBOLS } from "@/lib/poster/labels";
import { formatAxisMm, PALETTE, type CellView } from "@/lib/poster/marks";
import type { Grid } from "@/lib/sizing";

const HEADING: CSSProperties = { backgroundColor: PALETTE.heading, borderColor: PALETTE.rule };

/** A cell drawn as the poster draws it (lib/poster/marks): background, hatching, heavy border, rule colour. */
export function posterCellStyle(view: Pick<CellView, "background" | "hatch" | "border">): CSSProperties {
  return {
    backgroundColor: view.background,
    ...(view.hatch
      ? { backgroundImage: `repeating-linear-gradient(135deg, ${PALETTE.hatch} 0 1px, transparent 1px 9px)` }
      : {}),
    ...(view.border > 0 ? { boxShadow: `inset 0 0 0 3px ${PALETTE.ink}` } : {}),
    color: PALETTE.ink,
    borderColor: PALETTE.rule,
  };
}

/**
 * A lookup grid's heading row, as the poster draws it: the corner names both axes (vessel symbols,
 * and in words for screen readers), then one heading per column value. Shared by the designer's
 * preview, the wall view and the approval screen, which differ only in size and stickiness.
 */
export function GridHeadRow({
  grid,
  titles,
  cornerClassName,
  colClassName,
}: {
  grid: Pick<Grid, "rowAxis" | "colAxis">;
  titles: { rows: string; cols: string };
  cornerClassName: string;
  colClassName: string;
}) {
  return (
    <tr>
      <th scope="col" className={cornerClassName} style={HEADING}>
        <span aria-hidden="true">
          {VESSEL_SYMBOLS[grid.colAxis.vessel]} →<br />
          {VESSEL_SYMBOLS[grid.rowAxis.vessel]} ↓
        </span>
        <span className="sr-only">
          {titles.rows} down, {titles.cols} across
        </span>
      </th>
      {grid.colAxis.values.map((c) => (
        <th key={c} scope="col" className={colClassName} style={HEADING}>
          {formatAxisMm(c)}
        </th>
      ))}
    </tr>
  );
}
