import { approveEdition } from "@/db/queries/editions";
import { editionRoute } from "@/lib/auth/resource-guard";

export const POST = editionRoute("edition:approve", async (_req, member, editionId) => {
  const ed = await approveEdition({ labId: member.lab.id, editionId, actor: member.user });
  return Response.json({
    id: ed.id,
    number: ed.number,
    status: "approved",
    superseded: ed.superseded.map((p) => p.number),
  });
});
