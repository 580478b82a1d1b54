import { notFound } from "next/navigation";
import { ChartDesigner } from "@/components/charts/chart-designer";
import { EditionsPanel } from "@/components/charts/editions-panel";
import { LogoField } from "@/components/charts/logo-field";
import { Caution } from "@/components/ui/caution";
import { getChart } from "@/db/queries/charts";
import { getStock } from "@/db/queries/stock";
import { listEditions } from "@/db/queries/editions";
import { memberForPage } from "@/lib/auth/page-guard";
import { editionUrls } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { can } from "@/lib/permissions";
import { idParam } from "@/lib/validation/edition";

export default async function ChartPage({ params }: { params: Promise<{ slug: string; id: string }> }) {
  const { slug, id } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/charts/${id}`);
  if (member === "forbidden") return null;
  const chartId = idParam.safeParse(id);
  if (!chartId.success) notFound();
  const chart = await getChart({ labId: member.lab.id, chartId: chartId.data });
  if (!chart) notFound();
  const [stock, eds] = await Promise.all([
    getStock({ labId: member.lab.id }),
    listEditions({ labId: member.lab.id, chartId: chart.id }),
  ]);
  return (
    <div>
      <h1 className="text-2xl font-bold">{chart.title}</h1>
      <Caution className="my-4" />
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
          approve: can(member.role, "edition:approve"),
          withdraw: can(member.role, "edition:withdraw"),
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
          rejectionReason: e.rejectionReason,
          matchesToday: e.fingerprint === chart.liveFingerprint,
          ...editionUrls(env.APP_URL, e),
        }))}
      />
    </div>
  );
}
