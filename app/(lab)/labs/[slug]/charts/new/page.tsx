import { ChartDesigner } from "@/components/charts/chart-designer";
import { Caution } from "@/components/ui/caution";
import { Forbidden } from "@/components/ui/forbidden";
import { getStock } from "@/lib/ops/stock";
import { memberForPage } from "@/lib/auth/page-guard";
import { defaultLookup } from "@/lib/charts/defaults";
import { chartDefaults } from "@/lib/labs/rules";
import { getLabRules } from "@/lib/ops/lab-rules";
import type { ChartDefinition } from "@/lib/validation/chart";

export const metadata = { title: "New chart" };

export default async function NewChartPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const member = await memberForPage(slug, "chart:design", `/labs/${slug}/charts/new`);
  if (member === "forbidden") return <Forbidden what="design charts" slug={slug} />;
  const [stock, rules] = await Promise.all([
    getStock(member.caller, { lab: slug }),
    getLabRules(member.caller, { lab: slug }),
  ]);
  const family = stock.balloonFamilies.find((f) => f.compliance === "nc") ?? stock.balloonFamilies[0];
  // A new chart starts from the law, rounding and caps the lab's medical lead set as defaults.
  const start = chartDefaults(rules, "proximal");
  const initial: ChartDefinition = {
    title: "POT balloon chart",
    law: start.law,
    lookups: [{ ...defaultLookup("proximal", family), rounding: start.rounding }],
    stentPlatformId: stock.stentPlatforms[0]?.id ?? null,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
    notes: "",
    roundingCaps: start.roundingCaps,
  };
  return (
    <div>
      <h1 className="text-2xl font-bold">New chart</h1>
      <p className="mt-1 text-ink-soft">
        Axes start at this lab&apos;s stocked range in 0.25 mm steps; change anything and watch the preview.
      </p>
      <Caution className="my-4" demo={member.lab.isDemo} />
      <ChartDesigner slug={slug} chartId={null} initial={initial} stock={stock} labName={member.lab.name} canEdit />
    </div>
  );
}
