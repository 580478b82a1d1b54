const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const wellFormed = (s: string) => !LONE_SURROGATE.test(s);

/** The path of the first string (or key) in `value` that is not well-formed Unicode, or null. */
export function illFormedText(value: unknown, path: (string | number)[] = [], depth = 0): (string | number)[] | null {
  if (typeof value === "string") return wellFormed(value) ? null : path;
  if (typeof value !== "object" || value === null || depth > 20) return null;
  if (value instanceof FormData) {
    for (const [k, v] of value.entries()) {
      const hit = illFormedText(k, [k], depth + 1) ?? illFormedText(v, [k], depth + 1);
      if (hit) return hit;
    }
    return null;
  }
  for (const [k, v] of Object.entries(value)) {
    const key = Array.isArray(value) ? Number(k) : k;
    if (!wellFormed(k)) return [...path, key];
    const hit = illFormedText(v, [...path, key], depth + 1);
    if (hit) return hit;
  }
  return null;
}
