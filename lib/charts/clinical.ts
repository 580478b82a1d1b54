// Which part of a snapshot is clinical content: what a posted copy must agree with to stay on the
// wall. Wording and layout (title, notes, logo, lab name, paper) may change without making a copy
// wrong; the full fingerprint still tells editions apart.
import { fingerprintOf } from "./fingerprint";
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
] as const satisfies readonly (keyof Snapshot)[];

export type ClinicalPart = Omit<Snapshot, (typeof WORDING_FIELDS)[number]>;

export function clinicalPart(snapshot: Snapshot): ClinicalPart {
  const out: Record<string, unknown> = { ...snapshot };
  for (const f of WORDING_FIELDS) delete out[f];
  return out as ClinicalPart;
}

/** SHA-256 over the clinical part only: equal when two snapshots print the same clinical content. */
export const clinicalFingerprint = (snapshot: Snapshot): string => fingerprintOf(clinicalPart(snapshot));

/** Whether two snapshots differ only in wording or layout (false when they are identical). */
export function wordingOnly(a: Snapshot, b: Snapshot): boolean {
  return fingerprintOf(a) !== fingerprintOf(b) && clinicalFingerprint(a) === clinicalFingerprint(b);
}
