import { createStentSize } from "@/db/queries/stock";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { idParams, stentSizeInput } from "@/lib/validation/stock";

export const POST = labRoute<{ slug: string; id: string }>("stock:edit", async (req, member, params) => {
  const { id } = parseWith(idParams, params);
  const input = parseWith(stentSizeInput, await readJson(req));
  const result = await createStentSize({ labId: member.lab.id, actorUserId: member.user.id, platformId: id, input });
  return Response.json(result, { status: 201 });
});
