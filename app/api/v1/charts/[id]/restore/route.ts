import { api } from "@/lib/http/route";
import { restoreChart } from "@/lib/ops/charts";

// Restores an archived chart: it returns to the lists and its posted copies read what they are.
export const POST = api<{ id: string }>(async ({ caller, params, body }) =>
  restoreChart(caller, { chartId: params.id }, await body({ optional: true })),
);
