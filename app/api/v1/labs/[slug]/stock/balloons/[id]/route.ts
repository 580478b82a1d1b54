import { deleteBalloon, updateBalloon } from "@/db/queries/stock";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { balloonPatch, idParams } from "@/lib/validation/stock";

type Params = { slug: string; id: string };

export const PATCH = labRoute<Params>("stock:edit", async (req, member, params) => {
  const { id } = parseWith(idParams, params);
  const patch = parseWith(balloonPatch, await readJson(req));
  return Response.json(
    await updateBalloon({ labId: member.lab.id, actorUserId: member.user.id, balloonId: id, patch }),
  );
});

export const DELETE = labRoute<Params>("stock:edit", async (_req, member, params) => {
  const { id } = parseWith(idParams, params);
  return Response.json(await deleteBalloon({ labId: member.lab.id, actorUserId: member.user.id, balloonId: id }));
});
