"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { updateLabSettings } from "@/lib/ops/lab-settings";

// Every form names its lab in a hidden field `slug`; the operation checks the caller's role there.

/** The lab's settings form (`slug`, `name`, `timeZone`, `numberFormat`, `contactLine`): managers only. */
export async function updateLabSettingsAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, name, timeZone, numberFormat, contactLine }) => {
    const { changed } = await updateLabSettings(
      caller,
      { lab: String(slug) },
      { name, timeZone, numberFormat, contactLine },
    );
    // The name shows in the lab's header and dates on every lab page follow the time zone.
    revalidatePath(`/labs/${String(slug)}`, "layout");
    return { ok: true, message: changed.length ? "Settings saved." : "Nothing changed." };
  });
}
