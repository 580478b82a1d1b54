// What the designer says about the badge card's sides: for a side's lookup and chosen ranges,
// which rows and columns the card prints (lib/poster/card.ts narrows them the same way).
import { formatAxisMm } from "@/lib/poster/marks";
import { CARD_READING_DISTANCE_M, cardCapacity, defaultCardSides, narrowAxis } from "@/lib/poster/card";
import { resolveAxis, type AxisInput, type RoundingRule } from "@/lib/sizing";
import type { CardChoice, CardSide } from "@/lib/validation/chart";

export type CardAxisPlan = {
  /** Every value on the lookup's axis. */
  axis: number[];
  /** The values inside the chosen range (the whole axis when none is chosen). */
  chosen: number[];
  /** What the card prints: the chosen values, or their middle when more are chosen than fit. */
  printed: number[];
};

export type CardSidePlan = { capacity: { rows: number; cols: number }; rows: CardAxisPlan; cols: CardAxisPlan };

type LookupAxes = { rows: AxisInput; cols: AxisInput; rounding: RoundingRule };

/** The side's rows and columns as the card prints them; null while the lookup's axes are unusable. */
export function planCardSide(lookup: LookupAxes, side: CardSide): CardSidePlan | null {
  const rows = resolveAxis(lookup.rows);
  const cols = resolveAxis(lookup.cols);
  if (!rows.ok || !cols.ok) return null;
  const capacity = cardCapacity(lookup.rounding === "reach");
  const plan = (axis: number[], max: number, range?: [number, number]): CardAxisPlan => ({
    axis,
    chosen: narrowAxis(axis, Infinity, range),
    printed: narrowAxis(axis, max, range),
  });
  return {
    capacity,
    rows: plan(rows.values, capacity.rows, side.rows),
    cols: plan(cols.values, capacity.cols, side.cols),
  };
}

const span = (values: readonly number[]) =>
  values.length === 1
    ? `${formatAxisMm(values[0] as number)} mm`
    : `${formatAxisMm(values[0] as number)}–${formatAxisMm(values[values.length - 1] as number)} mm`;

const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** How many rows and columns of this lookup stay legible on the card. */
export function capacitySentence(plan: CardSidePlan): string {
  const { rows, cols } = plan.capacity;
  return `Legible at ${CARD_READING_DISTANCE_M * 100} cm: up to ${count(rows, "row", "rows")} × ${count(cols, "column", "columns")}.`;
}

/** One sentence per axis: what the card prints, and plainly when the chosen range is wider than fits. */
export function axisSentence(a: CardAxisPlan, which: "rows" | "columns"): string {
  const one = which === "rows" ? "row" : "column";
  if (a.chosen.length === 0) return `No ${which} lie in the chosen range.`;
  const chosen = `${count(a.chosen.length, one, which)} (${span(a.chosen)})`;
  if (a.printed.length === a.chosen.length) return `Prints all ${chosen}.`;
  return `Too wide: ${chosen} are chosen but ${a.printed.length} fit, so the card prints the middle ${a.printed.length}: ${span(a.printed)}.`;
}

/**
 * The card choice after lookup `removed` left the chart: sides on later lookups follow their
 * lookup down one place; a side on the removed lookup goes back to lookup 1 with whole axes.
 */
export function cardAfterRemovingLookup(
  card: CardChoice | null | undefined,
  removed: number,
): CardChoice | null | undefined {
  if (!card) return card;
  const move = (side: CardSide): CardSide =>
    side.lookup === removed ? { lookup: 0 } : side.lookup > removed ? { ...side, lookup: side.lookup - 1 } : side;
  return { sides: [move(card.sides[0]), move(card.sides[1])] };
}

/** The sides the designer shows: the chart's choice, else what the card prints by default. */
export function shownCardSides(card: CardChoice | null | undefined, lookupCount: number): [CardSide, CardSide] {
  return card?.sides ?? defaultCardSides(lookupCount);
}
