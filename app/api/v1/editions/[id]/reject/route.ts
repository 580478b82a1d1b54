import { rejectEdition } from "@/db/queries/editions";
import { parseWith, readJson } from "@/lib/auth/guard";
import { editionRoute } from "@/lib/auth/resource-guard";
import { rejectEditionSchema } from "@/lib/validation/edition";

export const POST = editionRoute("edition:approve", async (req, member, editionId) => {
  const { reason } = parseWith(rejectEditionSchema, await readJson(req));
  const ed = await rejectEdition({ labId: member.lab.id, editionId, actor: member.user, reason });
  return Response.json({ id: ed.id, number: ed.number, status: "draft", rejectionReason: reason });
});
