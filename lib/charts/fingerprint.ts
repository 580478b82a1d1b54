import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import { clinicalPart } from "./clinical";
import type { Snapshot } from "./snapshot";

/** SHA-256 of the RFC 8785 canonical JSON: key order and number format cannot change it. */
export function fingerprintOf(value: unknown): string {
  const canonical = canonicalize(value);
  if (canonical === undefined) throw new TypeError("Nothing to fingerprint");
  return createHash("sha256").update(canonical, "utf8").digest("hex");
}

/** The short form printed on posters and shown on pages. */
export const shortFingerprint = (fp: string) => fp.slice(0, 12);

/** SHA-256 over the clinical part only (lib/charts/clinical.ts): staleness, not identity. */
export const clinicalFingerprint = (snapshot: Snapshot): string => fingerprintOf(clinicalPart(snapshot));
