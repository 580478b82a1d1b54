import { FINET_DEFAULT_RATIO, type LookupKind } from "@/lib/sizing";
import { LOOKUP_KINDS, type ChartDefinition } from "@/lib/validation/chart";

export type FormIssue = { path: string; message: string };

/** The message react-hook-form keeps at a dotted path of its errors tree, if any. */
export function errorAt(errors: unknown, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[key];
  const message = (node as { message?: unknown } | undefined)?.message;
  return typeof message === "string" && message ? message : undefined;
}

/** Every message at or under `path` in the form's errors (the schema's on submit, or the server's). */
export function errorsUnder(node: unknown, path: string, out: FormIssue[] = []): FormIssue[] {
  if (!node || typeof node !== "object") return out;
  const { message, ...rest } = node as Record<string, unknown>;
  if (typeof message === "string" && message) out.push({ path, message });
  for (const [key, child] of Object.entries(rest))
    if (key !== "ref" && key !== "type" && key !== "types") errorsUnder(child, `${path}.${key}`, out);
  return out;
}

/** The card's problems as the form stands now, then any left from the last save not already said. */
export function mergeCardIssues(
  schemaIssues: readonly { path: readonly PropertyKey[]; message: string }[],
  savedErrors: unknown,
): FormIssue[] {
  const live = schemaIssues
    .filter((i) => i.path[0] === "card")
    .map((i) => ({ path: i.path.map(String).join("."), message: i.message }));
  const seen = new Set(live.map((i) => i.message));
  return [...live, ...errorsUnder(savedErrors, "card").filter((i) => !seen.has(i.message))];
}

/** A law chosen in the designer, with its parameter at the default. */
export function lawChoice(id: ChartDefinition["law"]["law"]): ChartDefinition["law"] {
  if (id === "finet") return { law: id, ratio: FINET_DEFAULT_RATIO };
  if (id === "power") return { law: id, n: 2.3 };
  return { law: id } as ChartDefinition["law"];
}

/** The first lookup kind the chart does not use yet, or null when all are used. */
export function nextLookupKind(used: Iterable<LookupKind>): LookupKind | null {
  const taken = new Set(used);
  return LOOKUP_KINDS.find((k) => !taken.has(k)) ?? null;
}
