import { DEFAULT_ROUNDING, type AxisRange, type LookupKind } from "@/lib/sizing";
import type { StockFamily } from "./snapshot";

const STEP = 0.25;
const snap = (x: number) => Math.round(x / STEP) * STEP;

/** The in-stock span of a family, on the 0.25 mm grid (the chart's default axis step). */
function stockedSpan(family: StockFamily | undefined): { lo: number; hi: number } {
  const sizes = (family?.balloons ?? []).filter((b) => b.inStock).map((b) => b.diameterMm);
  if (sizes.length === 0) return { lo: 2, hi: 4 };
  return { lo: snap(Math.min(...sizes)), hi: snap(Math.max(...sizes)) };
}

const range = (from: number, to: number): AxisRange => ({ from, to: Math.max(from, to), step: STEP });

/**
 * Default axes for a new lookup: the family's stocked range in 0.25 mm steps, with the branch
 * axes kept below the larger vessel so most cells have a size.
 */
export function defaultLookup(kind: LookupKind, family: StockFamily | undefined) {
  const { lo, hi } = stockedSpan(family);
  const rows =
    kind === "proximal"
      ? range(Math.max(lo, 2.25), Math.min(hi - STEP, lo + 7 * STEP))
      : range(Math.min(lo + 2 * STEP, hi), hi);
  const cols =
    kind === "proximal"
      ? range(lo, Math.min(rows.to - STEP, lo + 6 * STEP))
      : range(lo, Math.min(hi - 2 * STEP, lo + 7 * STEP));
  return { kind, rows, cols, rounding: DEFAULT_ROUNDING[kind], familyId: family?.id ?? 0 };
}
