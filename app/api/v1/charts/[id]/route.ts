import { editionSummary } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { api } from "@/lib/http/route";
import { getChart, patchChart } from "@/lib/ops/charts";

export const GET = api<{ id: string }>(async ({ caller, params }) => {
  const { chart, editions } = await getChart(caller, { chartId: params.id });
  const { id, title, definition, liveFingerprint } = chart;
  const eds = editions.map((e) => ({
    ...editionSummary(env.APP_URL, e),
    createdBy: e.createdByName,
    rejectionReason: e.rejectionReason,
  }));
  return { id, title, definition, liveFingerprint, editions: eds };
});

/** Changes only the fields given; every other field keeps its stored value. */
export const PATCH = api<{ id: string }>(async ({ caller, params, body }) =>
  patchChart(caller, { chartId: params.id }, await body()),
);
