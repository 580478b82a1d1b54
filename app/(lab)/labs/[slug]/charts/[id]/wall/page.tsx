import Link from "next/link";
import { WallGrid } from "@/components/charts/wall-grid";
import { OfflineNote } from "@/components/offline/offline-note";
import { Caution } from "@/components/ui/caution";
import { forPage, memberForPage } from "@/lib/auth/page-guard";
import { snapshotGrids } from "@/lib/charts/snapshot";
import { askWho } from "@/lib/editions/action";
import { formatDate } from "@/lib/format/dates";
import { chartWall } from "@/lib/ops/charts";
import { posterLegend } from "@/lib/poster/model";
import { MARKS, PALETTE } from "@/lib/poster/marks";
import { can } from "@/lib/permissions";

export const metadata = { title: "Wall view" };

// A symbol and a word with each colour, so the status reads in greyscale too.
const LOOK = {
  current: { symbol: "✓", word: "Current", cls: "border-ok bg-ok-soft text-ok" },
  review: { symbol: "?", word: "Due for review", cls: "border-review bg-review-soft text-review" },
  outdated: { symbol: "!", word: "Outdated: confirm each size", cls: "border-warn bg-warn-soft text-warn" },
} as const;

/** The chart's current approved edition, read-only, large, for every member of the lab. */
export default async function WallPage({ params }: { params: Promise<{ slug: string; id: string }> }) {
  const { slug, id } = await params;
  const here = `/labs/${slug}/charts/${id}/wall`;
  const member = await memberForPage(slug, "lab:read", here);
  if (member === "forbidden") return null;
  const { chart, edition } = await forPage(here, () => chartWall(member.caller, { chartId: id }));
  const tz = chart.timeZone;
  const designer = can(member.role, "chart:design") || can(member.role, "edition:create");
  const now = new Date();
  const current = edition ? edition.fingerprint === chart.liveFingerprint : false;
  const reviewDue = edition?.reviewBy ? edition.reviewBy.getTime() <= now.getTime() : false;

  const state = current ? (reviewDue ? "review" : "current") : "outdated";
  const dates = edition
    ? [
        edition.approvedAt ? `Approved ${formatDate(edition.approvedAt, tz)}` : null,
        edition.reviewBy ? `review by ${formatDate(edition.reviewBy, tz)}` : null,
      ].filter(Boolean)
    : [];

  return (
    <div className="min-w-0">
      <OfflineNote />
      <h1 className="text-xl font-bold leading-tight [overflow-wrap:anywhere] sm:text-2xl">{chart.title}</h1>
      {edition ? (
        <p
          className={`mt-1 rounded-md border-l-4 px-2 py-1 text-base font-bold ${LOOK[state].cls}`}
          data-testid="wall-status"
          data-status={state}
        >
          <span aria-hidden>{LOOK[state].symbol} </span>
          Edition {edition.number} · {LOOK[state].word}
        </p>
      ) : (
        <div
          className="mt-3 rounded-card border-4 border-danger bg-danger-soft px-4 py-3"
          data-testid="wall-status"
          data-status="none"
        >
          <p className="text-xl font-bold">No approved edition</p>
          <p className="mt-1 text-ink">
            This chart has no approved numbers to show. No approved edition yet: {askWho(chart.contactLine)}.
          </p>
        </div>
      )}
      {edition ? (
        <div className="mt-2 space-y-6">
          {snapshotGrids(edition.snapshot).map((grid, i) => (
            <WallGrid
              key={i}
              grid={grid}
              family={edition.snapshot.lookups[i]?.family ?? null}
              stentName={edition.snapshot.stent?.name ?? null}
            />
          ))}
          <div className="space-y-2" data-testid="wall-after-grid">
            <Caution demo={member.lab.isDemo} />
            {state === "outdated" ? (
              <p className="font-semibold text-ink">
                The lab&apos;s stock or settings changed since this edition was approved: some cells may no longer hold.
                Confirm each size before use; {askWho(chart.contactLine)}.
              </p>
            ) : state === "review" ? (
              <p className="font-semibold text-ink">
                Its review date has passed: {askWho(chart.contactLine)} to review the chart before relying on it.
              </p>
            ) : null}
            <p className="text-base text-ink-soft">{dates.join(" · ")}</p>
          </div>
          <section aria-labelledby="legend-h">
            <h2 id="legend-h" className="text-lg font-bold">
              How to read a cell
            </h2>
            <ul className="mt-2 space-y-2 text-sm">
              {posterLegend(edition.snapshot).map((e) => (
                <li key={e.mark} className="flex items-start gap-2">
                  <span
                    aria-hidden="true"
                    className="mt-0.5 inline-block h-5 w-8 shrink-0 border"
                    style={{
                      backgroundColor: (e.mark === "sized" ? null : MARKS[e.mark].background) ?? PALETTE.cell,
                      borderColor: PALETTE.rule,
                    }}
                  />
                  <span>
                    <strong>{e.label}.</strong> {e.text}
                  </span>
                </li>
              ))}
            </ul>
          </section>
          {edition.snapshot.notes ? <p className="text-sm text-ink-soft">{edition.snapshot.notes}</p> : null}
        </div>
      ) : null}
      {designer ? (
        <p className="mt-8">
          <Link href={`/labs/${slug}/charts/${id}`} className="text-brand-700 underline">
            Open the chart designer
          </Link>
        </p>
      ) : null}
    </div>
  );
}
