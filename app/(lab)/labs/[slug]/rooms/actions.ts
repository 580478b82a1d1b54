"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { archiveRoom, createRoom, renameRoom, restorePosting, takeDownPosting } from "@/lib/ops/postings";

// Every payload names its lab (`slug`) and, for a room or posting, its id.
const refresh = (slug: unknown) => revalidatePath(`/labs/${String(slug)}/rooms`);

export async function createRoomAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, name }) => {
    const room = await createRoom(caller, { lab: String(slug) }, { name });
    refresh(slug);
    return { ok: true, message: `Room "${room.name}" added.` };
  });
}

export async function renameRoomAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, roomId, name }) => {
    const room = await renameRoom(caller, { lab: String(slug), roomId }, { name });
    refresh(slug);
    return { ok: true, message: `Renamed to "${room.name}".` };
  });
}

export async function archiveRoomAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, roomId }) => {
    await archiveRoom(caller, { lab: String(slug), roomId });
    refresh(slug);
    return { ok: true, message: "Room removed." };
  });
}

export async function takeDownAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, postingId }) => {
    await takeDownPosting(caller, { lab: String(slug), postingId });
    refresh(slug);
    return { ok: true, message: "Recorded as taken down." };
  });
}

export async function restorePostingAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, postingId }) => {
    await restorePosting(caller, { lab: String(slug), postingId });
    refresh(slug);
    return { ok: true, message: "Put back on the room's list." };
  });
}
