"use server";

import { redirect } from "next/navigation";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { createLab } from "@/lib/ops/lab-create";

export async function createLabAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  let slug: string | null = null;
  const state = await runAction(payload, async (caller, values) => {
    slug = (await createLab(caller, { name: values.name, slug: values.slug })).lab.slug;
    return { ok: true };
  });
  if (slug) redirect(`/labs/${slug}`);
  return state;
}
