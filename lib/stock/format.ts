// Small pure helpers for stock numbers and names, safe to use in the browser too.

/** Diameters compared and keyed in hundredths of a millimetre, never as floats. */
export const hundredths = (mm: number): number => Math.round(mm * 100);

/** Family names match as MariaDB's case-insensitive collation does for everyday names. */
export const nameKey = (name: string): string => name.normalize("NFC").trim().toLowerCase();

export const formatMm = (mm: number): string => mm.toFixed(2);
export const formatAtm = (atm: number): string => (Number.isInteger(atm) ? String(atm) : atm.toFixed(1));

/** "2.75", "2,75" or "3" -> a number; "" -> undefined; anything else -> NaN. */
export function parseDecimalText(raw: string): number | undefined {
  const s = raw.trim();
  if (s === "") return undefined;
  if (!/^\+?\d{1,4}(?:[.,]\d{1,6})?$/.test(s)) return Number.NaN;
  return Number(s.replace(",", "."));
}

/** Form text -> number for the zod schemas: "" is missing, a decimal comma is accepted. */
export function numberFromInput(value: unknown): number | undefined {
  return typeof value === "number" ? value : parseDecimalText(String(value ?? ""));
}
