import { getChart, updateChart } from "@/db/queries/charts";
import { listEditions } from "@/db/queries/editions";
import { parseWith, readJson } from "@/lib/auth/guard";
import { chartRoute } from "@/lib/auth/resource-guard";
import { editionSummary } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { notFound } from "@/lib/errors";
import { chartDefinitionSchema, chartPatchSchema } from "@/lib/validation/chart";

export const GET = chartRoute("lab:read", async (_req, member, chartId) => {
  const chart = await getChart({ labId: member.lab.id, chartId });
  if (!chart) throw notFound("Chart");
  const eds = await listEditions({ labId: member.lab.id, chartId });
  return Response.json({
    id: chart.id,
    title: chart.title,
    definition: chart.definition,
    liveFingerprint: chart.liveFingerprint,
    editions: eds.map((e) => ({
      ...editionSummary(env.APP_URL, e),
      createdBy: e.createdByName,
      rejectionReason: e.rejectionReason,
    })),
  });
});

export const PATCH = chartRoute("chart:design", async (req, member, chartId) => {
  const patch = parseWith(chartPatchSchema, await readJson(req));
  const chart = await getChart({ labId: member.lab.id, chartId });
  if (!chart) throw notFound("Chart");
  const definition = parseWith(chartDefinitionSchema, { ...chart.definition, ...patch });
  await updateChart({ labId: member.lab.id, chartId, userId: member.user.id, definition });
  return Response.json({ id: chartId, definition });
});
