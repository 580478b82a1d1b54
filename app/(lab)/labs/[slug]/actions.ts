"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionState } from "@/lib/http/action";
import { setStaleMail } from "@/lib/ops/members";

/** A member's own choice: e-mail me when posted copies go stale. */
export async function setStaleMailAction(slug: string, on: boolean): Promise<ActionState> {
  return runAction({ on }, async (caller) => {
    const res = await setStaleMail(caller, { lab: slug }, { on });
    revalidatePath(`/labs/${slug}`);
    const message = res.on
      ? "You will get an e-mail when posted copies go stale."
      : "You will no longer get stale-copy e-mails.";
    return { ok: true, message };
  });
}
