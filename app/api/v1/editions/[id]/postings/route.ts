import { recordPosting } from "@/db/queries/rooms";
import { parseWith, readJson } from "@/lib/auth/guard";
import { editionRoute } from "@/lib/auth/resource-guard";
import { postingSchema } from "@/lib/validation/room";

/** Records that a printed copy of this edition hangs in a room. */
export const POST = editionRoute("posting:record", async (req, member, editionId) => {
  const { roomId } = parseWith(postingSchema, await readJson(req));
  const res = await recordPosting({ labId: member.lab.id, editionId, roomId, actor: member.user });
  return Response.json({ id: res.id, editionId, roomId }, { status: res.created ? 201 : 200 });
});
