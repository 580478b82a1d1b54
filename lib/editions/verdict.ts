import type { Change } from "@/lib/charts/changes";
import { sameClinical } from "@/lib/charts/clinical";
import type { Snapshot } from "@/lib/charts/snapshot";
import { copyAction, type CopyAction } from "./action";
import { checkEdition, type CheckEdition, type CheckStatus, type Reworded } from "./check";

/** The rows one check reads (db/queries/check.ts `readCheckRows`): nothing decided yet. */
export type CheckRows = {
  edition: CheckEdition & {
    shortCode: string;
    createdAt: Date;
    reviewBy: Date | null;
  };
  chart: {
    id: number;
    title: string;
    liveFingerprint: string | null;
    liveSnapshot: Snapshot | null;
    liveChangedAt: Date | null;
    archivedAt: Date | null;
  };
  lab: CheckLab;
  /** The chart's newest approved edition other than this copy. */
  current: { id: number; number: number; approvedAt: Date | null; fingerprint: string; snapshot: Snapshot } | null;
  /** The chart's newest draft. */
  draft: { number: number; fingerprint: string; snapshot: Snapshot } | null;
};

export type CheckLab = {
  id: number;
  slug: string;
  name: string;
  isDemo: boolean;
  timeZone: string;
  numberFormat: "point" | "comma";
  contactLine: string | null;
};

export type CheckView = {
  status: CheckStatus;
  action: CopyAction;
  reviewBy: Date | null;
  since: Date | null;
  edition: { id: number; number: number; approvedAt: Date | null; shortCode: string };
  chart: { id: number; title: string };
  lab: CheckLab;
  changes: Change[];
  currentEdition: { id: number; number: number; approvedAt: Date | null } | null;
  /** An edition that only rewords this copy (its clinical content is the same), when one exists. */
  reworded: Reworded | null;
  /** The snapshots the check page compares cell by cell (lib/editions/check-cells.ts). */
  snapshots: { printed: Snapshot; current: Snapshot | null; live: Snapshot | null };
};

/** When the copy's status began: the withdrawal, the supersession, the stock change, the approval or the draft. */
export function statusSince(status: CheckStatus, rows: Pick<CheckRows, "edition" | "chart">): Date | null {
  const { edition, chart } = rows;
  switch (status) {
    case "withdrawn":
      return edition.withdrawnAt ?? chart.archivedAt;
    case "superseded":
      return edition.supersededAt;
    case "outdated":
      return chart.liveChangedAt;
    case "current":
      return edition.approvedAt;
    case "draft":
      return edition.createdAt;
  }
}

/**
 * The approved edition that can replace the copy, or null: an archived chart has nothing to
 * replace its copies with. It "matches today" when it prints today's clinical content, also
 * when it only rewords today's chart.
 */
export function replacementOf(rows: Pick<CheckRows, "chart" | "current">) {
  const { chart, current } = rows;
  if (!current || chart.archivedAt !== null) return null;
  const matchesToday =
    current.fingerprint === chart.liveFingerprint ||
    (chart.liveSnapshot !== null && sameClinical(current.snapshot, chart.liveSnapshot));
  return { ...current, matchesToday };
}

/** Everything the check page shows for one copy, decided from the rows read for it. Pure. */
export function checkView(rows: CheckRows, now: Date): CheckView {
  const { edition, chart, lab, draft } = rows;
  const result = checkEdition(
    edition,
    { liveFingerprint: chart.liveFingerprint, liveSnapshot: chart.liveSnapshot, archivedAt: chart.archivedAt },
    rows.current,
    draft,
  );
  const replacement = replacementOf(rows);
  return {
    status: result.status,
    action: copyAction({ status: result.status, reviewBy: edition.reviewBy, replacement, now }),
    reviewBy: edition.reviewBy,
    since: statusSince(result.status, rows),
    edition: { id: edition.id, number: edition.number, approvedAt: edition.approvedAt, shortCode: edition.shortCode },
    chart: { id: chart.id, title: chart.title },
    lab,
    changes: result.changes,
    currentEdition: replacement
      ? { id: replacement.id, number: replacement.number, approvedAt: replacement.approvedAt }
      : null,
    reworded: result.reworded ?? null,
    snapshots: { printed: edition.snapshot, current: replacement?.snapshot ?? null, live: chart.liveSnapshot },
  };
}
