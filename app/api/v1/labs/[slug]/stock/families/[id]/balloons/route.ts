import { createBalloon } from "@/db/queries/stock";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { balloonInput, idParams } from "@/lib/validation/stock";

export const POST = labRoute<{ slug: string; id: string }>("stock:edit", async (req, member, params) => {
  const { id } = parseWith(idParams, params);
  const input = parseWith(balloonInput, await readJson(req));
  const result = await createBalloon({ labId: member.lab.id, actorUserId: member.user.id, familyId: id, input });
  return Response.json(result, { status: 201 });
});
