import { takeDownPosting } from "@/db/queries/rooms";
import { labRoute } from "@/lib/auth/guard";
import { notFound } from "@/lib/errors";
import { idParam } from "@/lib/validation/edition";

/** Takes a printed copy down from its wall. */
export const DELETE = labRoute<{ slug: string; id: string }>("posting:record", async (_req, member, params) => {
  const id = idParam.safeParse(params.id);
  if (!id.success) throw notFound("Posting");
  await takeDownPosting({ labId: member.lab.id, postingId: id.data, actor: member.user });
  return new Response(null, { status: 204 });
});
