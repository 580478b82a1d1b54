import { editionSummary } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { api } from "@/lib/http/route";
import { createChart, listCharts } from "@/lib/ops/charts";

export const GET = api<{ slug: string }>(async ({ caller, params, query }) =>
  (await listCharts(caller, { lab: params.slug }, query())).map(({ chart, current }) => ({
    id: chart.id,
    title: chart.title,
    paper: chart.definition.paper,
    orientation: chart.definition.orientation,
    law: chart.definition.law.law,
    lawSpec: chart.definition.law,
    currentEdition: current ? editionSummary(env.APP_URL, current) : null,
    archivedAt: chart.archivedAt?.toISOString() ?? null,
  })),
);

export const POST = api<{ slug: string }>(
  async ({ caller, params, body }) => createChart(caller, { lab: params.slug }, await body()),
  { status: 201 },
);
