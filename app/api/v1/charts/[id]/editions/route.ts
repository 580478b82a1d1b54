import { z } from "zod";
import { createEdition } from "@/db/queries/editions";
import { parseWith, readJson } from "@/lib/auth/guard";
import { chartRoute } from "@/lib/auth/resource-guard";
import { editionUrls } from "@/lib/charts/present";
import { env } from "@/lib/env";

// No options yet: the body is empty or {}, and anything else is refused rather than ignored.
const noOptions = z.object({}).strict();

export const POST = chartRoute("edition:create", async (req, member, chartId) => {
  parseWith(noOptions, await readJson(req, { optional: true }));
  const ed = await createEdition({ labId: member.lab.id, chartId, actor: member.user });
  return Response.json(
    { id: ed.id, number: ed.number, status: "draft", fingerprint: ed.fingerprint, ...editionUrls(env.APP_URL, ed) },
    { status: 201 },
  );
});
