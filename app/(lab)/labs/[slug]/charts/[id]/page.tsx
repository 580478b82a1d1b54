import { notFound } from "next/navigation";
import { ChartDesigner } from "@/components/charts/chart-designer";
import { EditionsPanel } from "@/components/charts/editions-panel";
import { LogoField } from "@/components/charts/logo-field";
import { Caution } from "@/components/ui/caution";
import { forPage } from "@/lib/auth/page-guard";
import { getChart } from "@/lib/ops/charts";
import { getStock } from "@/lib/ops/stock";
import { memberForPage } from "@/lib/auth/page-guard";
import { editionUrls } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { labCan } from "@/lib/ops/access";
import { can } from "@/lib/permissions";

export default async function ChartPage({ params }: { params: Promise<{ slug: string; id: string }> }) {
  const { slug, id } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/charts/${id}`);
  if (member === "forbidden") return null;
  const [{ chart, editions: eds }, stock] = await forPage(`/labs/${slug}/charts/${id}`, () =>
    Promise.all([getChart(member.caller, { chartId: id }), getStock(member.caller, { lab: slug })]),
  );
  // A chart of another lab is not found through this lab's address.
  if (chart.labId !== member.lab.id) notFound();
  return (
    <div>
      <h1 className="text-2xl font-bold">{chart.title}</h1>
      <Caution className="my-4" demo={member.lab.isDemo} />
      <ChartDesigner
        slug={slug}
        chartId={chart.id}
        initial={chart.definition}
        stock={stock}
        labName={member.lab.name}
        logoSha256={chart.logoSha256}
        canEdit={can(member.role, "chart:design")}
      />
      <LogoField
        slug={slug}
        chartId={chart.id}
        logoSha256={chart.logoSha256}
        canEdit={can(member.role, "chart:design")}
      />
      <EditionsPanel
        slug={slug}
        chartId={chart.id}
        can={{
          create: can(member.role, "edition:create"),
          approve: await labCan(member.lab.id, member.role, "edition:approve"),
          withdraw: can(member.role, "edition:withdraw"),
          // The archive copy is a managers-only download (lib/ops/renders.ts refuses anyone else).
          archive: member.role === "manager",
        }}
        editions={eds.map((e) => ({
          id: e.id,
          number: e.number,
          status: e.status,
          fingerprint: e.fingerprint,
          createdByName: e.createdByName,
          createdByMe: e.createdBy === member.user.id,
          createdAt: e.createdAt.toISOString(),
          approvedAt: e.approvedAt?.toISOString() ?? null,
          approvedByName: e.approvedByName,
          reviewBy: e.reviewBy?.toISOString() ?? null,
          rejectionReason: e.rejectionReason,
          matchesToday: e.fingerprint === chart.liveFingerprint,
          ...editionUrls(env.APP_URL, e),
        }))}
      />
    </div>
  );
}
