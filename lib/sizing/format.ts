/**
 * The one decimal-label function: every figure printed on a poster or shown in the preview, the
 * calculator or an API label goes through it. A number is first read as its decimal value (15
 * significant digits, which drops binary noise such as 5.085 being stored as 5.08499999...),
 * then rounded half away from zero in decimal, so 5.085 -> "5.09" and -2.5 -> "-3".
 */
export const DECIMAL_SIGNIFICANT_DIGITS = 15;

/** Digits and exponent of |x| as a decimal: value = 0.d1d2d3... × 10^exp. */
function decimalDigits(x: number): { digits: number[]; exp: number } {
  const s = Math.abs(x).toExponential(DECIMAL_SIGNIFICANT_DIGITS - 1); // "5.08500000000000e+0"
  const [mantissa, e] = s.split("e") as [string, string];
  const digits = mantissa.replace(".", "").split("").map(Number);
  return { digits, exp: Number(e) + 1 };
}

/**
 * x rounded half away from zero to `decimals` places, as text with exactly that many places
 * (`minDecimals` lets trailing zeros go down to that many: 3.00 -> "3.0" with minDecimals 1).
 */
export function formatDecimal(x: number, decimals: number, minDecimals = decimals): string {
  if (!Number.isFinite(x)) throw new RangeError("Only finite numbers can be formatted");
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 10) throw new RangeError("decimals must be 0..10");
  const negative = x < 0;
  let units: number[]; // all digits of the result, as an integer count of 10^-decimals
  if (x === 0) units = [0];
  else {
    const { digits, exp } = decimalDigits(x);
    // Place the digits so that index i stands for 10^(exp - 1 - i); keep `exp + decimals` of them.
    const keep = exp + decimals;
    if (keep < 0) units = [0];
    else {
      const kept = digits.slice(0, keep);
      while (kept.length < keep) kept.push(0);
      const next = keep < digits.length ? (digits[keep] as number) : 0;
      units = kept.length ? kept : [0];
      if (next >= 5) {
        let i = units.length - 1;
        if (kept.length === 0) units = [1];
        else {
          while (i >= 0) {
            const d = (units[i] as number) + 1;
            if (d < 10) {
              units[i] = d;
              break;
            }
            units[i] = 0;
            i--;
          }
          if (i < 0) units.unshift(1);
        }
      }
    }
  }
  let text = units.join("").replace(/^0+(?=\d)/, "");
  while (text.length <= decimals) text = "0" + text;
  let intPart = text.slice(0, text.length - decimals);
  let frac = text.slice(text.length - decimals);
  while (frac.length > minDecimals && frac.endsWith("0")) frac = frac.slice(0, -1);
  if (intPart === "") intPart = "0";
  const body = frac.length ? `${intPart}.${frac}` : intPart;
  const isZero = /^0(\.0*)?$/.test(body);
  return negative && !isZero ? `-${body}` : body;
}

/** Exact diameters from a law: two decimals. */
export const formatExactMm = (mm: number): string => formatDecimal(mm, 2);

/** Balloon and axis diameters as labelled on the shelf: one or two decimals (3.0, 2.75, 2.5). */
export const formatSizeMm = (mm: number): string => formatDecimal(mm, 2, 1);

/** The decimal value of a label, for JSON: Number(formatDecimal(...)). */
export const roundDecimal = (x: number, decimals: number): number => Number(formatDecimal(x, decimals));
