import { deleteStentPlatform, updateStentPlatform } from "@/db/queries/stock";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { idParams, stentPlatformInput } from "@/lib/validation/stock";

type Params = { slug: string; id: string };

export const PATCH = labRoute<Params>("stock:edit", async (req, member, params) => {
  const { id } = parseWith(idParams, params);
  const input = parseWith(stentPlatformInput, await readJson(req));
  return Response.json(
    await updateStentPlatform({ labId: member.lab.id, actorUserId: member.user.id, platformId: id, input }),
  );
});

export const DELETE = labRoute<Params>("stock:edit", async (_req, member, params) => {
  const { id } = parseWith(idParams, params);
  return Response.json(
    await deleteStentPlatform({ labId: member.lab.id, actorUserId: member.user.id, platformId: id }),
  );
});
