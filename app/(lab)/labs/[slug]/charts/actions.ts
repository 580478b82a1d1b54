"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionState } from "@/lib/http/action";
import { createChart, saveChart } from "@/lib/ops/charts";
import { approveEdition, createEdition, rejectEdition, withdrawEdition } from "@/lib/ops/editions";

const refresh = (slug: string) => revalidatePath(`/labs/${slug}/charts`, "layout");

export async function saveChartAction(slug: string, chartId: number | null, definition: unknown): Promise<ActionState> {
  return runAction({}, async (caller) => {
    if (chartId === null) {
      const { id } = await createChart(caller, { lab: slug }, definition);
      refresh(slug);
      return { ok: true, message: "Chart created.", id };
    }
    await saveChart(caller, { chartId }, definition);
    refresh(slug);
    return { ok: true, message: "Chart saved. Create an edition to print it." };
  });
}

export async function createEditionAction(slug: string, chartId: number): Promise<ActionState> {
  return runAction({}, async (caller) => {
    const ed = await createEdition(caller, { chartId });
    refresh(slug);
    if (ed.reused) return { ok: true, message: `Edition ${ed.number} is already a draft with exactly this content.` };
    return { ok: true, message: `Edition ${ed.number} created as a draft. Someone other than you must approve it.` };
  });
}

export async function approveEditionAction(slug: string, editionId: number, reviewed: boolean): Promise<ActionState> {
  return runAction({}, async (caller) => {
    const ed = await approveEdition(caller, { editionId }, { reviewed });
    refresh(slug);
    const superseded = ed.superseded.length ? ` Edition ${ed.superseded.join(", ")} is now superseded.` : "";
    return { ok: true, message: `Edition ${ed.number} approved.${superseded}` };
  });
}

export async function rejectEditionAction(slug: string, editionId: number, reason: string): Promise<ActionState> {
  return runAction({ reason }, async (caller) => {
    const ed = await rejectEdition(caller, { editionId }, { reason });
    refresh(slug);
    return { ok: true, message: `Edition ${ed.number} sent back with your reason; it can no longer be approved.` };
  });
}

export async function withdrawEditionAction(slug: string, editionId: number, reason: string): Promise<ActionState> {
  return runAction({ reason }, async (caller) => {
    const ed = await withdrawEdition(caller, { editionId }, { reason });
    refresh(slug);
    return { ok: true, message: `Edition ${ed.number} withdrawn.` };
  });
}
