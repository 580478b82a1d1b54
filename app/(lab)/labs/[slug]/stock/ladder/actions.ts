"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { createLadderFamily } from "@/lib/ops/first-run";

/** Adds a balloon family from the generic size ladder, with the pressures the manager entered. */
export async function createLadderFamilyAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, ...input }) => {
    const res = await createLadderFamily(caller, { lab: String(slug) }, input);
    revalidatePath(`/labs/${String(slug)}`);
    return { ok: true, message: `Added: ${res.summary}.` };
  });
}
