import { createChart, listCharts } from "@/db/queries/charts";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { editionSummary } from "@/lib/charts/present";
import { env } from "@/lib/env";
import { chartDefinitionSchema } from "@/lib/validation/chart";

export const GET = labRoute("lab:read", async (_req, member) => {
  const rows = await listCharts({ labId: member.lab.id });
  return Response.json(
    rows.map(({ chart, current }) => ({
      id: chart.id,
      title: chart.title,
      paper: chart.definition.paper,
      orientation: chart.definition.orientation,
      law: chart.definition.law.law,
      lawSpec: chart.definition.law,
      currentEdition: current ? editionSummary(env.APP_URL, current) : null,
    })),
  );
});

export const POST = labRoute("chart:design", async (req, member) => {
  const definition = parseWith(chartDefinitionSchema, await readJson(req));
  const { id } = await createChart({ labId: member.lab.id, userId: member.user.id, definition });
  return Response.json({ id, title: definition.title }, { status: 201 });
});
