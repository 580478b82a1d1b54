// Counted words chosen by the language's plural rules (Intl.PluralRules), never by string joins.

const rules = new Intl.PluralRules("en");

/** The form of a noun for a count: `{ one: "size", other: "sizes" }`. */
export type Forms = { one: string; other: string };

/** "1 size", "3 sizes", "no sizes" (`zero` words the empty case when given). */
export function count(n: number, forms: Forms, zero?: string): string {
  if (n === 0 && zero !== undefined) return zero;
  return `${n} ${rules.select(n) === "one" ? forms.one : forms.other}`;
}

/** The noun alone, in the form the count asks for. */
export function noun(n: number, forms: Forms): string {
  return rules.select(n) === "one" ? forms.one : forms.other;
}

/** "Room 1", "Room 1 and Room 2", "Room 1, Room 2, and Room 3". */
export function list(items: readonly string[]): string {
  return new Intl.ListFormat("en", { style: "long", type: "conjunction" }).format(items);
}

/** A role named after an article: "a manager", "an educator", "a medical lead". */
export function withArticle(word: string): string {
  return `${/^[aeiou]/i.test(word) ? "an" : "a"} ${word}`;
}
