import { api } from "@/lib/http/route";
import { archiveChart } from "@/lib/ops/charts";

// Archives the chart: it leaves the lists, keeps its editions, and its posted copies read take-down.
export const POST = api<{ id: string }>(async ({ caller, params, body }) =>
  archiveChart(caller, { chartId: params.id }, await body({ optional: true })),
);
