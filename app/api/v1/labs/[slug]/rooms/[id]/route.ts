import { archiveRoom, renameRoom } from "@/db/queries/rooms";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { notFound } from "@/lib/errors";
import { idParam } from "@/lib/validation/edition";
import { roomSchema } from "@/lib/validation/room";

const roomId = (raw: string) => {
  const parsed = idParam.safeParse(raw);
  if (!parsed.success) throw notFound("Room");
  return parsed.data;
};

export const PATCH = labRoute<{ slug: string; id: string }>("rooms:manage", async (req, member, params) => {
  const { name } = parseWith(roomSchema, await readJson(req));
  await renameRoom({ labId: member.lab.id, roomId: roomId(params.id), name, actor: member.user });
  return Response.json({ id: roomId(params.id), name });
});

export const DELETE = labRoute<{ slug: string; id: string }>("rooms:manage", async (_req, member, params) => {
  await archiveRoom({ labId: member.lab.id, roomId: roomId(params.id), actor: member.user });
  return new Response(null, { status: 204 });
});
