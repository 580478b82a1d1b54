import { describeChanges, type Change } from "@/lib/charts/changes";
import { clinicalKey, wordingOnly } from "@/lib/charts/clinical";
import type { Snapshot } from "@/lib/charts/snapshot";
import type { EditionStatus } from "./states";

/** What a printed copy is, as the check page says it. */
export type CheckStatus = "current" | "outdated" | "superseded" | "withdrawn" | "draft";
export const STALE: readonly CheckStatus[] = ["outdated", "superseded", "withdrawn"];

export type CheckEdition = {
  id: number;
  chartId: number;
  number: number;
  status: EditionStatus;
  fingerprint: string;
  snapshot: Snapshot;
  approvedAt: Date | null;
  supersededAt: Date | null;
  withdrawnAt: Date | null;
};

export type CheckChart = {
  liveFingerprint: string | null;
  liveSnapshot: Snapshot | null;
  /** Set when the lab archived the chart: every copy of it reads withdrawn. */
  archivedAt?: Date | null;
} | null;
/** The chart's approved edition other than this copy; with its snapshot a wording-only successor is recognised. */
export type NewerEdition = { number: number; approvedAt: Date | null; snapshot?: Snapshot } | null;
/** The newest draft of the chart, when one waits. */
export type WaitingDraft = { number: number; fingerprint: string; snapshot: Snapshot } | null;

/** An edition that differs from this copy only in wording or layout (title, notes, logo, paper). */
export type Reworded = { number: number; status: "approved" | "draft" };

export type CheckResult = { status: CheckStatus; changes: Change[]; reworded?: Reworded };

/**
 * The status rules: the edition's own state first (withdrawn, superseded, draft); an approved
 * edition is outdated when the chart resolved against today's stock and settings prints other
 * clinical content (lib/charts/clinical.ts), and current when it prints the same (so restoring
 * the stock makes it current again). A wording-only change keeps the copy current, and so does
 * being superseded by an edition that only rewords it; `reworded` then names that edition.
 */
export function checkEdition(
  ed: CheckEdition,
  chart: CheckChart,
  newer: NewerEdition,
  draft: WaitingDraft = null,
): CheckResult {
  const clinical = clinicalKey(ed.snapshot);
  const live = chart?.liveSnapshot ? clinicalKey(chart.liveSnapshot) : null;
  const fmt = (d: Date | null) => (d ? d.toISOString().slice(0, 10) : "an unknown date");
  if (ed.status === "withdrawn")
    return {
      status: "withdrawn",
      changes: [{ kind: "lab", detail: `Edition ${ed.number} was withdrawn on ${fmt(ed.withdrawnAt)}` }],
    };
  if (chart?.archivedAt)
    return {
      status: "withdrawn",
      changes: [{ kind: "lab", detail: `The chart was archived on ${fmt(chart.archivedAt)}` }],
    };
  if (ed.status === "superseded") {
    // Superseded by an edition that only rewords it, and still true today: the copy stays current.
    // (An identical re-approval, e.g. at review time, still supersedes: its poster carries the new review-by date.)
    if (newer?.snapshot && live === clinical && wordingOnly(ed.snapshot, newer.snapshot))
      return { status: "current", changes: [], reworded: { number: newer.number, status: "approved" } };
    const detail = newer
      ? `Edition ${newer.number} approved on ${fmt(newer.approvedAt)}`
      : `A newer edition was approved on ${fmt(ed.supersededAt)}`;
    return { status: "superseded", changes: [{ kind: "lab", detail }] };
  }
  // A draft sent back was never approved: it reads as a draft.
  if (ed.status === "draft" || ed.status === "returned") return { status: "draft", changes: [] };
  if (!chart || !chart.liveFingerprint || !chart.liveSnapshot)
    return { status: "outdated", changes: describeChanges(ed.snapshot, null) };
  if (chart.liveFingerprint === ed.fingerprint) return { status: "current", changes: [] };
  // Only the wording or layout changed since approval: what the copy prints clinically is still true.
  if (live === clinical) {
    const rewordedDraft = draft && draft.fingerprint !== ed.fingerprint && clinicalKey(draft.snapshot) === clinical;
    return rewordedDraft
      ? { status: "current", changes: [], reworded: { number: draft.number, status: "draft" } }
      : { status: "current", changes: [] };
  }
  const changes = describeChanges(ed.snapshot, chart.liveSnapshot);
  return {
    status: "outdated",
    changes: changes.length
      ? changes
      : [{ kind: "lab", detail: "The chart's inputs changed since this edition was approved" }],
  };
}

export const CHECK_HEADLINES: Record<CheckStatus, string> = {
  current: "Current",
  outdated: "Outdated",
  superseded: "Superseded",
  withdrawn: "Withdrawn",
  draft: "Draft - not for clinical use",
};
