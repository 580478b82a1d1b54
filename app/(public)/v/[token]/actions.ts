"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { checkByToken, recordPosting, takeDownPosting } from "@/lib/ops/postings";

/** "This copy hangs in ...": any member of the edition's lab may record it (`token`, `roomId`). */
export async function recordPostingAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { token, roomId }) => {
    const check = await checkByToken(caller, { token: String(token) });
    const res = await recordPosting(caller, { editionId: check.edition.id }, { roomId });
    revalidatePath(`/v/${String(token)}/lab`);
    return {
      ok: true,
      message: res.created ? "Recorded: this copy hangs there." : "That room already has this copy recorded.",
    };
  });
}

export async function takeDownPostingAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { token, postingId }) => {
    const check = await checkByToken(caller, { token: String(token) });
    await takeDownPosting(caller, { lab: check.lab.slug, postingId });
    revalidatePath(`/v/${String(token)}/lab`);
    return { ok: true, message: "Recorded as taken down." };
  });
}
