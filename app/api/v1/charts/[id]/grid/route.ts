import { getChart } from "@/db/queries/charts";
import { chartRoute } from "@/lib/auth/resource-guard";
import { liveGridJson } from "@/lib/charts/grid-model";
import { AppError, notFound } from "@/lib/errors";

// What an edition made now would print: the chart's live snapshot, cell by cell.
export const GET = chartRoute("lab:read", async (_req, member, chartId) => {
  const chart = await getChart({ labId: member.lab.id, chartId });
  if (!chart) throw notFound("Chart");
  if (!chart.liveSnapshot) throw new AppError("unavailable", "This chart's grid is being computed; try again.");
  return Response.json(liveGridJson(chart.liveSnapshot, chart.definition));
});
