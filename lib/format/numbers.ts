/** How a lab prints decimals on posters (labs.number_format): 3.25 or 3,25. */
export type NumberFormat = "point" | "comma";

/** A fixed-decimals figure with the lab's decimal separator; never a thousands separator. */
export function formatDecimal(value: number, decimals: number, format: NumberFormat = "point"): string {
  const text = value.toFixed(decimals);
  return format === "comma" ? text.replace(".", ",") : text;
}
