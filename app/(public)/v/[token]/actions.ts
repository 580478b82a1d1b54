"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getCheckByToken } from "@/db/queries/check";
import { recordPosting, takeDownPosting } from "@/db/queries/rooms";
import { memberAction, type ActionState } from "@/lib/auth/action-guard";
import { idParam } from "@/lib/validation/edition";
import { checkTokenSchema } from "@/lib/validation/check";

async function labOfToken(token: string) {
  if (!checkTokenSchema.safeParse(token).success) return null;
  return getCheckByToken({ token });
}

const roomInput = z.object({ roomId: idParam }).strict();
const postingInput = z.object({ postingId: idParam }).strict();

/** "This copy hangs in ...": any member of the edition's lab may record it. */
export async function recordPostingAction(token: string, roomId: number): Promise<ActionState> {
  const check = await labOfToken(token);
  if (!check) return { ok: false, message: "This check link does not exist." };
  return memberAction(check.lab.slug, "posting:record", roomInput, { roomId }, async (member, data) => {
    const res = await recordPosting({
      labId: member.lab.id,
      editionId: check.edition.id,
      roomId: data.roomId,
      actor: member.user,
    });
    revalidatePath(`/v/${token}`);
    return {
      ok: true,
      message: res.created ? "Recorded: this copy hangs there." : "That room already has this copy recorded.",
    };
  });
}

export async function takeDownPostingAction(token: string, postingId: number): Promise<ActionState> {
  const check = await labOfToken(token);
  if (!check) return { ok: false, message: "This check link does not exist." };
  return memberAction(check.lab.slug, "posting:record", postingInput, { postingId }, async (member, data) => {
    await takeDownPosting({ labId: member.lab.id, postingId: data.postingId, actor: member.user });
    revalidatePath(`/v/${token}`);
    return { ok: true, message: "Recorded as taken down." };
  });
}
