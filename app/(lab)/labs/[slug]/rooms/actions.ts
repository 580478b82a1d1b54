"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionState } from "@/lib/http/action";
import { archiveRoom, createRoom, renameRoom, takeDownPosting } from "@/lib/ops/postings";

const refresh = (slug: string) => revalidatePath(`/labs/${slug}/rooms`);

export async function createRoomAction(slug: string, _prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(form, async (caller, values) => {
    const room = await createRoom(caller, { lab: slug }, values);
    refresh(slug);
    return { ok: true, message: `Room "${room.name}" added.` };
  });
}

export async function renameRoomAction(slug: string, roomId: number, name: string): Promise<ActionState> {
  return runAction({ name }, async (caller) => {
    const room = await renameRoom(caller, { lab: slug, roomId }, { name });
    refresh(slug);
    return { ok: true, message: `Renamed to "${room.name}".` };
  });
}

export async function archiveRoomAction(slug: string, roomId: number): Promise<ActionState> {
  return runAction({}, async (caller) => {
    await archiveRoom(caller, { lab: slug, roomId });
    refresh(slug);
    return { ok: true, message: "Room removed." };
  });
}

export async function takeDownAction(slug: string, postingId: number): Promise<ActionState> {
  return runAction({}, async (caller) => {
    await takeDownPosting(caller, { lab: slug, postingId });
    refresh(slug);
    return { ok: true, message: "Recorded as taken down." };
  });
}
