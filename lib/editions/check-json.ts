import type { Change } from "@/lib/charts/changes";
import type { CheckStatus } from "./check";

/** The public JSON of a check: lab and chart names, never personal data. */
export type CheckJson = {
  status: CheckStatus;
  since: string | null;
  edition: { number: number; approvedAt: string | null };
  chart: { title: string };
  lab: { name: string };
  changes: Change[];
  currentEdition: { number: number; approvedAt: string | null } | null;
};

export function checkJson(v: {
  status: CheckStatus;
  since: Date | null;
  edition: { number: number; approvedAt: Date | null };
  chart: { title: string };
  lab: { name: string };
  changes: Change[];
  currentEdition: { number: number; approvedAt: Date | null } | null;
}): CheckJson {
  return {
    status: v.status,
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
