import type { Change } from "@/lib/charts/changes";
import type { CopyAction } from "./action";
import type { CheckStatus } from "./check";

/** The public JSON of a check: lab and chart names, never personal data. */
export type CheckJson = {
  status: CheckStatus;
  /** What to do with the copy: keep, replace, take-down or review (lib/editions/action.ts). */
  action: CopyAction;
  reviewBy: string | null;
  since: string | null;
  edition: { number: number; approvedAt: string | null };
  chart: { title: string };
  lab: { name: string };
  changes: Change[];
  currentEdition: { number: number; approvedAt: string | null } | null;
};

export function checkJson(v: {
  status: CheckStatus;
  action: CopyAction;
  reviewBy: Date | null;
  since: Date | null;
  edition: { number: number; approvedAt: Date | null };
  chart: { title: string };
  lab: { name: string };
  changes: Change[];
  currentEdition: { number: number; approvedAt: Date | null } | null;
}): CheckJson {
  return {
    status: v.status,
    action: v.action,
    reviewBy: v.reviewBy?.toISOString() ?? null,
    since: v.since?.toISOString() ?? null,
    edition: { number: v.edition.number, approvedAt: v.edition.approvedAt?.toISOString() ?? null },
    chart: { title: v.chart.title },
    lab: { name: v.lab.name },
    changes: v.changes.map((c) => ({ kind: c.kind, detail: c.detail })),
    currentEdition: v.currentEdition
      ? { number: v.currentEdition.number, approvedAt: v.currentEdition.approvedAt?.toISOString() ?? null }
      : null,
  };
}
