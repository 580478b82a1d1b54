"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { labRulesImpact, setLabRules } from "@/lib/ops/lab-rules";
import { impactSentence } from "@/lib/stock/impact";

/** The rules page's one save: the medical lead's change (with the revision read) to the lab's rules. */
export async function saveLabRulesAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, ...changes }) => {
    const res = await setLabRules(caller, { lab: String(slug) }, changes);
    revalidatePath(`/labs/${String(slug)}/rules`);
    revalidatePath(`/labs/${String(slug)}/charts`, "layout");
    return {
      ok: true,
      message: res.changed.length ? "The rules were saved and recorded in the audit log." : "Nothing changed.",
      data: { revision: res.revision },
    };
  });
}

/** The posted copies the medical lead's change would make outdated, before it is saved; writes nothing. */
export async function rulesImpactAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, ...changes }) => {
    const { outdates } = await labRulesImpact(caller, { lab: String(slug) }, changes);
    return { ok: true, message: impactSentence(outdates), data: { outdates } };
  });
}
