import type { Change } from "@/lib/charts/changes";
import { DEFAULT_TIME_ZONE } from "@/lib/format/dates";
import type { CopyAction } from "./action";
import type { CheckStatus, Reworded } from "./check";

/** The public JSON of a check: lab and chart names, never personal data. */
export type CheckJson = {
  status: CheckStatus;
  /** What to do with the copy: keep, replace, take-down or review (lib/editions/action.ts). */
  action: CopyAction;
  reviewBy: string | null;
  since: string | null;
  edition: { number: number; approvedAt: string | null };
  chart: { title: string };
  /** `timeZone`: the lab's IANA zone, in which pages show these dates (lib/format/dates.ts). */
  /** `contactLine`: whom the lab's manager says to ask (settings), or null for the default. */
  lab: { name: string; timeZone: string; contactLine: string | null };
  changes: Change[];
  currentEdition: { number: number; approvedAt: string | null } | null;
  /** True when an edition that only rewords this copy exists (same clinical content); it is named below. */
  reworded: boolean;
  rewordedEdition: Reworded | null;
};

export function checkJson(v: {
  status: CheckStatus;
  action: CopyAction;
  reviewBy: Date | null;
  since: Date | null;
  edition: { number: number; approvedAt: Date | null };
  chart: { title: string };
  lab: { name: string; timeZone?: string; contactLine?: string | null };
  changes: Change[];
  currentEdition: { number: number; approvedAt: Date | null } | null;
  reworded?: Reworded | null;
}): CheckJson {
  return {
    status: v.status,
    action: v.action,
    reviewBy: v.reviewBy?.toISOString() ?? null,
    since: v.since?.toISOString() ?? null,
    edition: { number: v.edition.number, approvedAt: v.edition.approvedAt?.toISOString() ?? null },
    chart: { title: v.chart.title },
    lab: { name: v.lab.name, timeZone: v.lab.timeZone ?? DEFAULT_TIME_ZONE, contactLine: v.lab.contactLine ?? null },
    changes: v.changes.map((c) => ({ kind: c.kind, detail: c.detail })),
    currentEdition: v.currentEdition
      ? { number: v.currentEdition.number, approvedAt: v.currentEdition.approvedAt?.toISOString() ?? null }
      : null,
    reworded: Boolean(v.reworded),
    rewordedEdition: v.reworded ? { number: v.reworded.number, status: v.reworded.status } : null,
  };
}

/** The one line the check page adds when a reworded edition exists. */
export function rewordedSentence(r: Reworded): string {
  const which = r.status === "approved" ? `edition ${r.number}` : `edition ${r.number}, waiting for sign-off`;
  return `A reworded edition is available (${which}): only its wording or layout differs, so this printout may stay up.`;
}
