"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { setStaleMailSetting } from "@/db/queries/members";
import { memberAction, type ActionState } from "@/lib/auth/action-guard";

/** A member's own choice: e-mail me when posted copies go stale. Only ever changes the caller's own membership. */
export async function setStaleMailAction(slug: string, on: boolean): Promise<ActionState> {
  return memberAction(slug, "lab:read", z.object({ on: z.boolean() }).strict(), { on }, async (member, data) => {
    await setStaleMailSetting({ labId: member.lab.id, userId: member.user.id, on: data.on });
    revalidatePath(`/labs/${slug}`);
    return {
      ok: true,
      message: data.on
        ? "You will get an e-mail when posted copies go stale."
        : "You will no longer get stale-copy e-mails.",
    };
  });
}
