// Which part of a snapshot is clinical content: what a posted copy must agree with to stay on the
// wall. Wording and layout (title, notes, logo, lab name, paper, the badge card's sides) may
// change without making a copy wrong; the full fingerprint still tells editions apart. No node:
// imports (the check page's client code reaches this file through lib/editions/check.ts).
import canonicalize from "canonicalize";
import type { Snapshot } from "./snapshot";

/**
 * Fields that never change a printed size, pressure, mark, law or axis. Everything else counts
 * as clinical, so a field added to the snapshot later makes copies outdated until it is listed here.
 */
export const WORDING_FIELDS = [
  "title",
  "notes",
  "logoSha256",
  "lab",
  "paper",
  "orientation",
  "readingDistanceM",
  // The medical lead's recorded exceptions are printed as words; they change no cell.
  "ruleExceptions",
  // Which lookup and range each side of the badge card prints: a cut of the same cells, no cell changes.
  "card",
] as const satisfies readonly (keyof Snapshot)[];

export type ClinicalPart = Omit<Snapshot, (typeof WORDING_FIELDS)[number]>;

export function clinicalPart(snapshot: Snapshot): ClinicalPart {
  const out: Record<string, unknown> = { ...snapshot };
  for (const f of WORDING_FIELDS) delete out[f];
  return out as ClinicalPart;
}

/** The clinical part as RFC 8785 canonical JSON: equal strings, equal clinical content. */
export const clinicalKey = (snapshot: Snapshot): string => canonicalize(clinicalPart(snapshot)) ?? "";

export const sameClinical = (a: Snapshot, b: Snapshot): boolean => clinicalKey(a) === clinicalKey(b);

/** Whether two snapshots differ only in wording or layout (false when they are identical). */
export function wordingOnly(a: Snapshot, b: Snapshot): boolean {
  return canonicalize(a) !== canonicalize(b) && sameClinical(a, b);
}
