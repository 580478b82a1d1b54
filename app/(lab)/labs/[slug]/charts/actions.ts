"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { createChart, updateChart } from "@/db/queries/charts";
import { approveEdition, createEdition, rejectEdition, withdrawEdition } from "@/db/queries/editions";
import { memberAction, type ActionState } from "@/lib/auth/action-guard";
import { chartDefinitionSchema } from "@/lib/validation/chart";
import { idParam, rejectEditionSchema, withdrawEditionSchema } from "@/lib/validation/edition";

const chartsPath = (slug: string) => `/labs/${slug}/charts`;

export async function saveChartAction(slug: string, chartId: number | null, definition: unknown): Promise<ActionState> {
  return memberAction(slug, "chart:design", chartDefinitionSchema, definition, async (member, def) => {
    if (chartId === null) {
      const { id } = await createChart({ labId: member.lab.id, userId: member.user.id, definition: def });
      revalidatePath(chartsPath(slug));
      return { ok: true, message: "Chart created.", id };
    }
    await updateChart({
      labId: member.lab.id,
      chartId: idParam.parse(chartId),
      userId: member.user.id,
      definition: def,
    });
    revalidatePath(chartsPath(slug), "layout");
    return { ok: true, message: "Chart saved. Create an edition to print it." };
  });
}

const chartRef = z.object({ chartId: idParam }).strict();
const editionRef = z.object({ editionId: idParam }).strict();

export async function createEditionAction(slug: string, chartId: number): Promise<ActionState> {
  return memberAction(slug, "edition:create", chartRef, { chartId }, async (member, { chartId: id }) => {
    const ed = await createEdition({ labId: member.lab.id, chartId: id, actor: member.user });
    revalidatePath(chartsPath(slug), "layout");
    return { ok: true, message: `Edition ${ed.number} created as a draft. Someone other than you must approve it.` };
  });
}

export async function approveEditionAction(slug: string, editionId: number): Promise<ActionState> {
  return memberAction(slug, "edition:approve", editionRef, { editionId }, async (member, { editionId: id }) => {
    const ed = await approveEdition({ labId: member.lab.id, editionId: id, actor: member.user });
    revalidatePath(chartsPath(slug), "layout");
    return {
      ok: true,
      message: `Edition ${ed.number} approved.${ed.superseded.length ? ` Edition ${ed.superseded.map((s) => s.number).join(", ")} is now superseded.` : ""}`,
    };
  });
}

export async function rejectEditionAction(slug: string, editionId: number, reason: string): Promise<ActionState> {
  return memberAction(
    slug,
    "edition:approve",
    editionRef.extend(rejectEditionSchema.shape),
    { editionId, reason },
    async (member, data) => {
      const ed = await rejectEdition({
        labId: member.lab.id,
        editionId: data.editionId,
        actor: member.user,
        reason: data.reason,
      });
      revalidatePath(chartsPath(slug), "layout");
      return { ok: true, message: `Edition ${ed.number} sent back to draft.` };
    },
  );
}

export async function withdrawEditionAction(slug: string, editionId: number, reason: string): Promise<ActionState> {
  return memberAction(
    slug,
    "edition:withdraw",
    editionRef.extend(withdrawEditionSchema.shape),
    { editionId, reason: reason || undefined },
    async (member, data) => {
      const ed = await withdrawEdition({
        labId: member.lab.id,
        editionId: data.editionId,
        actor: member.user,
        reason: data.reason ?? null,
      });
      revalidatePath(chartsPath(slug), "layout");
      return { ok: true, message: `Edition ${ed.number} withdrawn.` };
    },
  );
}
