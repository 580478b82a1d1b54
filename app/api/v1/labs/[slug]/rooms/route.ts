import { api } from "@/lib/http/route";
import { createRoom, roomBoard } from "@/lib/ops/postings";

/** The room board: every room, what hangs there and its status, stale rooms first. */
export const GET = api<{ slug: string }>(({ caller, params }) => roomBoard(caller, { lab: params.slug }));

export const POST = api<{ slug: string }>(
  async ({ caller, params, body }) => createRoom(caller, { lab: params.slug }, await body()),
  { status: 201 },
);
