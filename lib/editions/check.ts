import { describeChanges, type Change } from "@/lib/charts/changes";
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

export type CheckChart = { liveFingerprint: string | null; liveSnapshot: Snapshot | null } | null;
export type NewerEdition = { number: number; approvedAt: Date | null } | null;

export type CheckResult = { status: CheckStatus; changes: Change[] };

/**
 * The status rules: the edition's own state first (withdrawn, superseded, draft); an approved
 * edition is outdated when the chart resolved against today's stock and settings has another
 * fingerprint, and current when it has the same (so restoring the stock makes it current again).
 */
export function checkEdition(ed: CheckEdition, chart: CheckChart, newer: NewerEdition): CheckResult {
  const fmt = (d: Date | null) => (d ? d.toISOString().slice(0, 10) : "an unknown date");
  if (ed.status === "withdrawn")
    return {
      status: "withdrawn",
      changes: [{ kind: "lab", detail: `Edition ${ed.number} was withdrawn on ${fmt(ed.withdrawnAt)}` }],
    };
  if (ed.status === "superseded") {
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
