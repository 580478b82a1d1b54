"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { setStaleMail } from "@/lib/ops/members";

/** A member's own choice (`slug`, `on`): e-mail me when posted copies go stale. */
export async function setStaleMailAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, on }) => {
    const res = await setStaleMail(caller, { lab: String(slug) }, { on });
    revalidatePath(`/labs/${String(slug)}`);
    const message = res.on
      ? "You will get an e-mail when posted copies go stale."
      : "You will no longer get stale-copy e-mails.";
    return { ok: true, message };
  });
}
