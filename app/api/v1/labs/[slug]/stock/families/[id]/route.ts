import { deleteBalloonFamily, updateBalloonFamily } from "@/db/queries/stock";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { balloonFamilyPatch, idParams } from "@/lib/validation/stock";

type Params = { slug: string; id: string };

export const PATCH = labRoute<Params>("stock:edit", async (req, member, params) => {
  const { id } = parseWith(idParams, params);
  const patch = parseWith(balloonFamilyPatch, await readJson(req));
  return Response.json(
    await updateBalloonFamily({ labId: member.lab.id, actorUserId: member.user.id, familyId: id, patch }),
  );
});

export const DELETE = labRoute<Params>("stock:edit", async (_req, member, params) => {
  const { id } = parseWith(idParams, params);
  return Response.json(await deleteBalloonFamily({ labId: member.lab.id, actorUserId: member.user.id, familyId: id }));
});
