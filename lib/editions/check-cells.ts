import { diffCells, type CellDiff } from "@/lib/charts/cell-diff";
import type { Snapshot } from "@/lib/charts/snapshot";
import type { CopyAction } from "./action";
import type { CheckStatus } from "./check";

/**
 * The cells the check page lists under the action:
 * - `replace`: the cells where the replacement edition prints something else, with both values
 *   (both are approved numbers);
 * - `affected`: an outdated copy that nothing approved replaces: the printed cells that no
 *   longer match today's chart, to be struck through. Today's values are never shown: no one
 *   approved them.
 */
export type CheckCells =
  | { kind: "none" }
  | { kind: "replace"; replacementNumber: number; cells: CellDiff[] }
  | { kind: "affected"; cells: CellDiff[] };

export function checkCells(v: {
  status: CheckStatus;
  action: CopyAction;
  currentEdition: { number: number } | null;
  snapshots: { printed: Snapshot; current: Snapshot | null; live: Snapshot | null };
}): CheckCells {
  if (v.action === "replace" && v.currentEdition && v.snapshots.current)
    return {
      kind: "replace",
      replacementNumber: v.currentEdition.number,
      cells: diffCells(v.snapshots.printed, v.snapshots.current),
    };
  if (v.action === "take-down" && v.status === "outdated")
    return { kind: "affected", cells: diffCells(v.snapshots.printed, v.snapshots.live) };
  return { kind: "none" };
}
