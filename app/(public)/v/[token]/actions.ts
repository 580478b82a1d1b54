"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionState } from "@/lib/http/action";
import { checkByToken, recordPosting, takeDownPosting } from "@/lib/ops/postings";

/** "This copy hangs in ...": any member of the edition's lab may record it. */
export async function recordPostingAction(token: string, roomId: number): Promise<ActionState> {
  return runAction({ roomId }, async (caller) => {
    const check = await checkByToken(caller, { token });
    const res = await recordPosting(caller, { editionId: check.edition.id }, { roomId });
    revalidatePath(`/v/${token}`);
    return {
      ok: true,
      message: res.created ? "Recorded: this copy hangs there." : "That room already has this copy recorded.",
    };
  });
}

export async function takeDownPostingAction(token: string, postingId: number): Promise<ActionState> {
  return runAction({}, async (caller) => {
    const check = await checkByToken(caller, { token });
    await takeDownPosting(caller, { lab: check.lab.slug, postingId });
    revalidatePath(`/v/${token}`);
    return { ok: true, message: "Recorded as taken down." };
  });
}
