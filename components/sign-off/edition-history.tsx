import Link from "next/link";
import { StatusBadge } from "@/components/ui/status-badge";
import { formatDateTime } from "@/lib/format/dates";
import type { EditionStatus } from "@/lib/editions/states";

export type HistoryLine = {
  id: number;
  number: number;
  status: EditionStatus;
  createdAt: Date;
  createdByName: string | null;
  approvedAt: Date | null;
  approvedByName: string | null;
  againstNumber: number | null;
  changedCells: number;
  changedItems: string[];
};

/** Every edition of a chart: who drafted and approved it, when, and what it changed; each opens its diff. */
export function EditionHistory({ slug, lines, timeZone }: { slug: string; lines: HistoryLine[]; timeZone: string }) {
  if (!lines.length) return null;
  return (
    <section aria-labelledby="history-h" className="mt-6 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="history-h" className="text-lg font-semibold">
        History of editions
      </h2>
      <ol className="mt-2 space-y-2" data-testid="edition-history">
        {lines.map((e) => (
          <li key={e.id} className="min-w-0 border-t border-line pt-2 text-sm" data-testid={`history-${e.number}`}>
            <p className="flex flex-wrap items-center gap-2">
              <Link href={`/labs/${slug}/sign-off/${e.id}`} className="font-semibold text-brand-700 underline">
                Edition {e.number}: what it changed
              </Link>
              <StatusBadge status={e.status} />
            </p>
            <p className="mt-0.5 break-words">
              Drafted by {e.createdByName ?? "a former member"} on {formatDateTime(e.createdAt, timeZone)}
              {e.approvedAt
                ? `; approved by ${e.approvedByName ?? "a former member"} on ${formatDateTime(e.approvedAt, timeZone)}`
                : "; not approved"}
              .
            </p>
            <p className="mt-0.5 break-words text-ink-soft">
              {e.againstNumber === null
                ? `Against no earlier edition: all ${e.changedCells} printed cells are new.`
                : `Against edition ${e.againstNumber}: ${e.changedCells} printed ${e.changedCells === 1 ? "cell" : "cells"} changed; ${
                    e.changedItems.length
                      ? `printed items changed: ${e.changedItems.join(", ")}`
                      : "no other printed item changed"
                  }.`}
            </p>
          </li>
        ))}
      </ol>
    </section>
  );
}
