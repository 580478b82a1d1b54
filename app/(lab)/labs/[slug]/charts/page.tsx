import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Forbidden } from "@/components/ui/forbidden";
import { StatusBadge } from "@/components/ui/status-badge";
import { formatDate } from "@/lib/format/dates";
import { listCharts } from "@/lib/ops/charts";
import { memberForPage } from "@/lib/auth/page-guard";
import { PAPERS } from "@/lib/poster/paper";
import { can } from "@/lib/permissions";
import { lawName } from "@/lib/sizing";

export const metadata = { title: "Charts" };

export default async function ChartsPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/charts`);
  if (member === "forbidden") return <Forbidden what="see charts" slug={slug} />;
  const archived = (await searchParams).archived === "1";
  const rows = await listCharts(member.caller, { lab: slug }, archived ? { archived: "1" } : {});
  const canDesign = can(member.role, "chart:design");
  return (
    <div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">{archived ? "Archived charts" : "Wall charts"}</h1>
        {canDesign && !archived ? (
          <Link href={`/labs/${slug}/charts/new`} className={buttonClass("primary")}>
            New chart
          </Link>
        ) : null}
      </div>
      <nav aria-label="Which charts" className="mt-3 flex gap-4 text-sm">
        {archived ? (
          <Link href={`/labs/${slug}/charts`} className="text-brand-700 underline">
            ← Charts in use
          </Link>
        ) : (
          <Link href={`/labs/${slug}/charts?archived=1`} className="text-brand-700 underline">
            Archived charts
          </Link>
        )}
      </nav>
      {rows.length === 0 && archived ? (
        <div className="mt-6">
          <EmptyState title="No archived charts">
            A manager or the medical lead can archive a chart that is no longer used; it then appears here with its
            editions, and its posted copies read &quot;take down&quot;.
          </EmptyState>
        </div>
      ) : rows.length === 0 ? (
        <div className="mt-6">
          <EmptyState title="No charts yet">
            {canDesign
              ? "Design a chart from this lab's stock and chosen law; then create an edition and have it approved."
              : "An educator or manager designs the lab's charts; they will appear here."}
          </EmptyState>
        </div>
      ) : (
        <ul className="mt-6 divide-y divide-line rounded-card border border-line bg-paper-raised">
          {rows.map(({ chart, current }) => {
            const stale =
              current?.status === "approved" &&
              chart.liveFingerprint !== null &&
              chart.liveFingerprint !== current.fingerprint;
            return (
              <li key={chart.id} className="flex flex-wrap items-center gap-4 px-5 py-4">
                <div className="min-w-0 flex-1">
                  <Link
                    href={`/labs/${slug}/charts/${chart.id}`}
                    className="text-lg font-semibold text-brand-800 hover:underline"
                  >
                    {chart.title}
                  </Link>
                  <p className="text-sm text-ink-faint">
                    {lawName(chart.definition.law)} · {chart.definition.lookups.length} lookup
                    {chart.definition.lookups.length > 1 ? "s" : ""} · {PAPERS[chart.definition.paper].label}{" "}
                    {chart.definition.orientation}
                  </p>
                </div>
                <div className="flex items-center gap-2">
                  {current ? (
                    <StatusBadge
                      status={current.status}
                      label={`${current.status === "approved" ? "Approved" : "Draft"} · edition ${current.number}`}
                    />
                  ) : (
                    <StatusBadge status="none" />
                  )}
                  {stale && !archived ? <StatusBadge status="outdated" label="Stock or settings changed" /> : null}
                  {chart.archivedAt ? (
                    <span className="rounded-md border border-line-strong px-2 py-0.5 text-xs font-semibold">
                      ▣ Archived {formatDate(chart.archivedAt, member.lab.timeZone)}
                    </span>
                  ) : null}
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
