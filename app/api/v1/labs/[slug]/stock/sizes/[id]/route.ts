import { deleteStentSize, updateStentSize } from "@/db/queries/stock";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { idParams, stentSizePatch } from "@/lib/validation/stock";

type Params = { slug: string; id: string };

export const PATCH = labRoute<Params>("stock:edit", async (req, member, params) => {
  const { id } = parseWith(idParams, params);
  const patch = parseWith(stentSizePatch, await readJson(req));
  return Response.json(await updateStentSize({ labId: member.lab.id, actorUserId: member.user.id, sizeId: id, patch }));
});

export const DELETE = labRoute<Params>("stock:edit", async (_req, member, params) => {
  const { id } = parseWith(idParams, params);
  return Response.json(await deleteStentSize({ labId: member.lab.id, actorUserId: member.user.id, sizeId: id }));
});
