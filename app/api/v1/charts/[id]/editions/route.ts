import { createEdition } from "@/db/queries/editions";
import { chartRoute } from "@/lib/auth/resource-guard";
import { editionUrls } from "@/lib/charts/present";
import { env } from "@/lib/env";

export const POST = chartRoute("edition:create", async (_req, member, chartId) => {
  const ed = await createEdition({ labId: member.lab.id, chartId, actor: member.user });
  return Response.json({ id: ed.id, number: ed.number, status: "draft", fingerprint: ed.fingerprint, ...editionUrls(env.APP_URL, ed) }, { status: 201 });
});
