import { withdrawEdition } from "@/db/queries/editions";
import { parseWith, readJson } from "@/lib/auth/guard";
import { editionRoute } from "@/lib/auth/resource-guard";
import { withdrawEditionSchema } from "@/lib/validation/edition";

export const POST = editionRoute("edition:withdraw", async (req, member, editionId) => {
  const { reason } = parseWith(withdrawEditionSchema, await readJson(req, { optional: true }));
  const ed = await withdrawEdition({ labId: member.lab.id, editionId, actor: member.user, reason: reason ?? null });
  return Response.json({ id: ed.id, number: ed.number, status: "withdrawn" });
});
