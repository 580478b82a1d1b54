import { RulesEditor } from "@/components/rules/rules-editor";
import { Caution } from "@/components/ui/caution";
import { memberForPage } from "@/lib/auth/page-guard";
import { listCharts } from "@/lib/ops/charts";
import { getLabRules } from "@/lib/ops/lab-rules";
import { can } from "@/lib/permissions";

export const metadata = { title: "Lab rules" };

export default async function RulesPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "lab:read", `/labs/${slug}/rules`);
  if (member === "forbidden") return null;
  const [rules, charts] = await Promise.all([
    getLabRules(member.caller, { lab: slug }),
    listCharts(member.caller, { lab: slug }),
  ]);
  const canEdit = can(member.role, "rules:manage");
  return (
    <div className="space-y-4">
      <h1 className="text-xl font-bold">Lab rules</h1>
      <p className="max-w-prose text-ink-soft">
        The laws, rounding and caps this lab accepts for each kind of lookup, how long an approval lasts, who may
        approve, and the exceptions recorded for single charts. A chart outside these rules cannot be approved.{" "}
        {canEdit
          ? "As the medical lead you change them here; every change is audited."
          : "Only the medical lead changes them."}
      </p>
      <Caution demo={member.lab.isDemo} />
      <RulesEditor
        slug={slug}
        canEdit={canEdit}
        rules={rules}
        charts={charts.map((c) => ({ id: c.chart.id, title: c.chart.title }))}
      />
    </div>
  );
}
