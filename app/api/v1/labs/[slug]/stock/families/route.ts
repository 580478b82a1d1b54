import { createBalloonFamily } from "@/db/queries/stock";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { balloonFamilyInput } from "@/lib/validation/stock";

export const POST = labRoute("stock:edit", async (req, member) => {
  const input = parseWith(balloonFamilyInput, await readJson(req));
  const result = await createBalloonFamily({ labId: member.lab.id, actorUserId: member.user.id, input });
  return Response.json(result, { status: 201 });
});
