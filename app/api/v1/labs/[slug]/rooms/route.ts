import { createRoom, roomBoard } from "@/db/queries/rooms";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { roomSchema } from "@/lib/validation/room";

/** The room board: every room, what hangs there and its status, stale rooms first. */
export const GET = labRoute("lab:read", async (_req, member) => {
  const board = await roomBoard({ labId: member.lab.id });
  return Response.json(board);
});

export const POST = labRoute("rooms:manage", async (req, member) => {
  const { name } = parseWith(roomSchema, await readJson(req));
  const { id } = await createRoom({ labId: member.lab.id, name, actor: member.user });
  return Response.json({ id, name }, { status: 201 });
});
