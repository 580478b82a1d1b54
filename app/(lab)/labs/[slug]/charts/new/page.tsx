import { ChartDesigner } from "@/components/charts/chart-designer";
import { Caution } from "@/components/ui/caution";
import { Forbidden } from "@/components/ui/forbidden";
import { getStock } from "@/lib/ops/stock";
import { memberForPage } from "@/lib/auth/page-guard";
import { isChartTemplate, templateDefinition } from "@/lib/charts/templates";
import { getLabRules } from "@/lib/ops/lab-rules";

export const metadata = { title: "New chart" };

export default async function NewChartPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ template?: string }>;
}) {
  const { slug } = await params;
  const asked = (await searchParams).template;
  const member = await memberForPage(slug, "chart:design", `/labs/${slug}/charts/new`);
  if (member === "forbidden") return <Forbidden what="design charts" slug={slug} />;
  const [stock, rules] = await Promise.all([
    getStock(member.caller, { lab: slug }),
    getLabRules(member.caller, { lab: slug }),
  ]);
  // The first-run path links here with ?template=pot|kissing; a plain "New chart" starts as POT.
  // Either starts from the law, rounding and caps the lab's medical lead set as defaults.
  const initial = templateDefinition(isChartTemplate(asked) ? asked : "pot", stock, rules);
  return (
    <div>
      <h1 className="text-2xl font-bold">New chart</h1>
      <p className="mt-1 text-ink-soft">
        Axes start at this lab&apos;s stocked range in 0.25 mm steps; change anything and watch the preview.
      </p>
      <Caution className="my-4" demo={member.lab.isDemo} />
      <ChartDesigner
        slug={slug}
        chartId={null}
        initial={initial}
        stock={stock}
        labName={member.lab.name}
        canEdit
        labRules={rules}
      />
    </div>
  );
}
