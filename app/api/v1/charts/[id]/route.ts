import { api } from "@/lib/http/route";
import { getChart, patchChart } from "@/lib/ops/charts";

export const GET = api<{ id: string }>(({ caller, params }) => getChart(caller, { chartId: params.id }));

/** Changes only the fields given; every other field keeps its stored value. */
export const PATCH = api<{ id: string }>(async ({ caller, params, body }) =>
  patchChart(caller, { chartId: params.id }, await body()),
);
