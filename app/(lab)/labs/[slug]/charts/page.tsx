import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Forbidden } from "@/components/ui/forbidden";
import { StatusBadge } from "@/components/ui/status-badge";
import { listCharts } from "@/lib/ops/charts";
import { memberForPage } from "@/lib/auth/page-guard";
import { PAPERS } from "@/lib/poster/paper";
import { can } from "@/lib/permissions";
import { lawName } from "@/lib/sizing";

export const metadata = { title: "Charts" };

export default async function ChartsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/charts`);
  if (member === "forbidden") return <Forbidden what="see charts" slug={slug} />;
  const rows = await listCharts(member.caller, { lab: slug });
  const canDesign = can(member.role, "chart:design");
  return (
    <div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">Wall charts</h1>
        {canDesign ? (
          <Link href={`/labs/${slug}/charts/new`} className={buttonClass("primary")}>
            New chart
          </Link>
        ) : null}
      </div>
      {rows.length === 0 ? (
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
                  {stale ? <StatusBadge status="outdated" label="Stock or settings changed" /> : null}
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
