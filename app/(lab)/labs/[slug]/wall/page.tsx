import Link from "next/link";
import { OfflineNote } from "@/components/offline/offline-note";
import { EmptyState } from "@/components/ui/empty-state";
import { Forbidden } from "@/components/ui/forbidden";
import { memberForPage } from "@/lib/auth/page-guard";
import { formatDate } from "@/lib/format/dates";
import { listCharts } from "@/lib/ops/charts";

export const metadata = { title: "Wall charts" };

/** Where an operator lands: the lab's charts that have an approved edition, each opening its wall view. */
export default async function WallChartsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/wall`);
  if (member === "forbidden") return <Forbidden what="see wall charts" slug={slug} />;
  const rows = (await listCharts(member.caller, { lab: slug }, {})).filter((r) => r.current?.status === "approved");
  const tz = member.lab.timeZone;
  return (
    <div>
      <OfflineNote />
      <h1 className="text-xl font-bold sm:text-2xl">Wall charts</h1>
      {rows.length === 0 ? (
        <div className="mt-4">
          <EmptyState title="No approved chart yet">
            Charts appear here once the lab has approved an edition of them.
          </EmptyState>
        </div>
      ) : (
        <ul className="mt-3 grid gap-3 sm:grid-cols-2" data-testid="wall-charts">
          {rows.map(({ chart, current }) => (
            <li key={chart.id}>
              <Link
                href={`/labs/${slug}/charts/${chart.id}/wall`}
                className="block min-h-11 rounded-card border border-line bg-paper-raised p-4 hover:border-brand-500"
              >
                <span className="block text-lg font-semibold [overflow-wrap:anywhere]">{chart.title}</span>
                <span className="text-base text-ink-soft">
                  Edition {current!.number}
                  {current!.approvedAt ? `, approved ${formatDate(current!.approvedAt, tz)}` : ""}
                  {current!.fingerprint !== chart.liveFingerprint ? " · outdated: confirm each size" : ""}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
