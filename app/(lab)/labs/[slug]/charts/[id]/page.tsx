import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { ChartArchive } from "@/components/charts/archive-chart";
import { ChartDesigner } from "@/components/charts/chart-designer";
import { EditionsPanel } from "@/components/charts/editions-panel";
import { EditionHistory } from "@/components/sign-off/edition-history";
import { LogoField } from "@/components/charts/logo-field";
import { RuleIssues } from "@/components/rules/rule-issues";
import { Caution } from "@/components/ui/caution";
import { forPage } from "@/lib/auth/page-guard";
import { getChart } from "@/lib/ops/charts";
import { chartEditionHistory } from "@/lib/ops/editions";
import { getStock } from "@/lib/ops/stock";
import { memberForPage } from "@/lib/auth/page-guard";
import { editionUrls } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { formatDate } from "@/lib/format/dates";
import { checkChartAgainstRules, ruledDefinition } from "@/lib/labs/rules";
import { labCan } from "@/lib/ops/access";
import { getLabRules } from "@/lib/ops/lab-rules";
import { can, type Role } from "@/lib/permissions";

async function designerUseful(labId: number, role: Role) {
  return (
    can(role, "chart:design") ||
    can(role, "edition:create") ||
    can(role, "edition:withdraw") ||
    (await labCan(labId, role, "edition:approve"))
  );
}

export default async function ChartPage({ params }: { params: Promise<{ slug: string; id: string }> }) {
  const { slug, id } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/charts/${id}`);
  if (member === "forbidden") return null;
  // A role with nothing to do in the designer (an operator) reads the approved chart on the wall view.
  if (!(await designerUseful(member.lab.id, member.role))) redirect(`/labs/${slug}/charts/${id}/wall`);
  const [{ chart, editions: eds }, stock, rules, history] = await forPage(`/labs/${slug}/charts/${id}`, () =>
    Promise.all([
      getChart(member.caller, { chartId: id }),
      getStock(member.caller, { lab: slug }),
      getLabRules(member.caller, { lab: slug }),
      chartEditionHistory(member.caller, { chartId: id }),
    ]),
  );
  // A chart of another lab is not found through this lab's address.
  if (chart.labId !== member.lab.id) notFound();
  const ruled = checkChartAgainstRules(chart.id, ruledDefinition(chart.definition), rules);
  // Said at the top, not only in the editions list far below the designer.
  const outdatedApproval = eds.find((e) => e.status === "approved" && e.fingerprint !== chart.liveFingerprint);
  return (
    <div>
      <h1 className="text-2xl font-bold">{chart.title}</h1>
      {chart.archivedAt ? (
        <p
          role="status"
          className="mt-2 rounded-md border border-line-strong bg-paper-sunk px-3 py-2 text-sm font-semibold"
        >
          ▣ Archived on {formatDate(chart.archivedAt, member.lab.timeZone)}: this chart gets no new editions, and its
          posted copies read &quot;take down&quot;.
        </p>
      ) : null}
      {outdatedApproval ? (
        <p
          role="status"
          data-testid="approval-outdated"
          className="mt-2 rounded-md border border-warn/50 bg-warn-soft px-3 py-2 text-sm font-semibold"
        >
          <span aria-hidden>⚠ </span>The approved edition {outdatedApproval.number} no longer matches this chart (stock
          or settings changed since): create a new edition and have it approved, then replace the posted copies.
        </p>
      ) : null}
      <p className="mt-1">
        <Link href={`/labs/${slug}/charts/${id}/wall`} className="text-brand-700 underline">
          Wall view of the approved edition
        </Link>
      </p>
      <Caution className="my-4" demo={member.lab.isDemo} />
      <ChartDesigner
        slug={slug}
        chartId={chart.id}
        initial={chart.definition}
        stock={stock}
        labName={member.lab.name}
        logoSha256={chart.logoSha256}
        canEdit={can(member.role, "chart:design")}
        labRules={rules}
      />
      <LogoField
        slug={slug}
        chartId={chart.id}
        logoSha256={chart.logoSha256}
        canEdit={can(member.role, "chart:design")}
      />
      <RuleIssues slug={slug} issues={ruled.issues} applied={ruled.applied} />
      <EditionsPanel
        slug={slug}
        timeZone={member.lab.timeZone}
        chartId={chart.id}
        can={{
          create: can(member.role, "edition:create") && !chart.archivedAt,
          approve: await labCan(member.lab.id, member.role, "edition:approve"),
          withdraw: can(member.role, "edition:withdraw"),
          // The archive copy is a managers-only download (lib/ops/renders.ts refuses anyone else).
          archive: can(member.role, "edition:archive-copy"),
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
      <EditionHistory slug={slug} lines={history} timeZone={member.lab.timeZone} />
      {can(member.role, "chart:archive") ? (
        <ChartArchive slug={slug} chartId={chart.id} title={chart.title} archived={chart.archivedAt !== null} />
      ) : null}
    </div>
  );
}
