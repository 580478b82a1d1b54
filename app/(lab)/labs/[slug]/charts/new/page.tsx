import { ChartDesigner } from "@/components/charts/chart-designer";
import { Caution } from "@/components/ui/caution";
import { Forbidden } from "@/components/ui/forbidden";
import { getStock } from "@/lib/ops/stock";
import { memberForPage } from "@/lib/auth/page-guard";
import { defaultLookup } from "@/lib/charts/defaults";
import { DEFAULT_ROUNDING_CAPS, FINET_DEFAULT_RATIO } from "@/lib/sizing";
import type { ChartDefinition } from "@/lib/validation/chart";

export const metadata = { title: "New chart" };

// Templates offered by a new lab's first-run path: a POT chart (proximal lookup) or a chart for
// kissing-balloon inflation (side-branch and main-branch lookups).
const TEMPLATES = {
  pot: { title: "POT balloon chart", kinds: ["proximal"] },
  kissing: { title: "Kissing-balloon chart", kinds: ["side", "main"] },
} as const;

export default async function NewChartPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ template?: string }>;
}) {
  const { slug } = await params;
  const asked = (await searchParams).template;
  const template = asked === "kissing" ? TEMPLATES.kissing : TEMPLATES.pot;
  const member = await memberForPage(slug, "chart:design", `/labs/${slug}/charts/new`);
  if (member === "forbidden") return <Forbidden what="design charts" slug={slug} />;
  const stock = await getStock(member.caller, { lab: slug });
  const family = stock.balloonFamilies.find((f) => f.compliance === "nc") ?? stock.balloonFamilies[0];
  const initial: ChartDefinition = {
    title: template.title,
    law: { law: "finet", ratio: FINET_DEFAULT_RATIO },
    lookups: template.kinds.map((kind) => defaultLookup(kind, family)),
    stentPlatformId: stock.stentPlatforms[0]?.id ?? null,
    paper: "A2",
    orientation: "portrait",
    readingDistanceM: 1.5,
    notes: "",
    roundingCaps: { ...DEFAULT_ROUNDING_CAPS },
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
