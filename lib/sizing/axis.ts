export type AxisRange = { from: number; to: number; step: number };
export type AxisInput = readonly number[] | AxisRange;
export type AxisResult = { ok: true; values: number[] } | { ok: false; reason: string };

/** Axis bounds, mm: wide enough for any coronary diameter a chart would show. */
export const AXIS_MIN_MM = 0.5;
export const AXIS_MAX_MM = 10;
export const AXIS_MAX_VALUES = 30;

/** Whole hundredths of a mm, or null when the value is not on the 0.01 mm grid. */
function toHundredths(x: number): number | null {
  if (!Number.isFinite(x)) return null;
  const h = Math.round(x * 100);
  return Math.abs(x * 100 - h) <= 1e-6 ? h : null;
}

const mm = (h: number): string => (h / 100).toFixed(2);
const bad = (reason: string): AxisResult => ({ ok: false, reason });

/**
 * Axis values from an explicit list or an inclusive { from, to, step } range. Everything is
 * computed in whole hundredths of a mm, so a range gives 2.25, 2.5, 2.75 exactly. Values must
 * be on the 0.01 mm grid, within AXIS_MIN_MM..AXIS_MAX_MM, strictly ascending, at most
 * AXIS_MAX_VALUES; a range must land exactly on its `to`.
 */
export function resolveAxis(input: AxisInput): AxisResult {
  let hundredths: number[];
  if (Array.isArray(input)) {
    const list = input as readonly number[];
    if (list.length === 0) return bad("Give at least one axis value");
    hundredths = [];
    for (const v of list) {
      const h = toHundredths(v);
      if (h === null) return bad("Axis values must be numbers in hundredths of a mm");
      hundredths.push(h);
    }
    for (let i = 1; i < hundredths.length; i++) {
      if ((hundredths[i] as number) <= (hundredths[i - 1] as number)) {
        return bad("Axis values must be ascending with no repeats");
      }
    }
  } else {
    const { from, to, step } = input as AxisRange;
    const f = toHundredths(from);
    const t = toHundredths(to);
    const s = toHundredths(step);
    if (f === null || t === null || s === null) {
      return bad("Axis from, to and step must be numbers in hundredths of a mm");
    }
    if (s <= 0) return bad("The axis step must be greater than zero");
    if (t < f) return bad("The axis must run from a smaller to a larger value");
    if ((t - f) % s !== 0) {
      return bad(`Steps of ${mm(s)} mm from ${mm(f)} mm do not land on ${mm(t)} mm`);
    }
    const count = (t - f) / s + 1;
    if (count > AXIS_MAX_VALUES)
      return bad(`An axis has at most ${AXIS_MAX_VALUES} values (this range gives ${count})`);
    hundredths = Array.from({ length: count }, (_, k) => f + k * s);
  }
  if (hundredths.length > AXIS_MAX_VALUES) return bad(`An axis has at most ${AXIS_MAX_VALUES} values`);
  const lo = Math.round(AXIS_MIN_MM * 100);
  const hi = Math.round(AXIS_MAX_MM * 100);
  if (hundredths.some((h) => h < lo || h > hi)) {
    return bad(`Axis values must be between ${mm(lo)} and ${mm(hi)} mm`);
  }
  return { ok: true, values: hundredths.map((h) => h / 100) };
}
