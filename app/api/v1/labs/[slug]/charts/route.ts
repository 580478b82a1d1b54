import { api } from "@/lib/http/route";
import { createChart, listCharts } from "@/lib/ops/charts";

export const GET = api<{ slug: string }>(({ caller, params }) => listCharts(caller, { lab: params.slug }));

export const POST = api<{ slug: string }>(
  async ({ caller, params, body }) => createChart(caller, { lab: params.slug }, await body()),
  { status: 201 },
);
