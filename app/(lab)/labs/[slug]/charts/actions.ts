"use server";

import { revalidatePath } from "next/cache";
import { runAction, uploadedFile, type ActionPayload, type ActionState } from "@/lib/http/action";
import { archiveChart, createChart, removeChartLogo, restoreChart, saveChart, setChartLogo } from "@/lib/ops/charts";
import { approveEdition, createEdition, rejectEdition, withdrawEdition } from "@/lib/ops/editions";
import { LOGO_MAX_BYTES, LOGO_TOO_LARGE_HINT } from "@/lib/logo";

// Payloads name the lab (`slug`, for the page to refresh) and the chart or edition by id.
const refresh = (slug: unknown) => revalidatePath(`/labs/${String(slug)}/charts`, "layout");

/** Creates a chart from `definition`, or replaces the definition of `chartId`. */
export async function saveChartAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, chartId, definition }) => {
    if (!chartId) {
      const { id } = await createChart(caller, { lab: String(slug) }, definition);
      refresh(slug);
      return { ok: true, message: "Chart created.", id };
    }
    await saveChart(caller, { chartId }, definition);
    refresh(slug);
    return { ok: true, message: "Chart saved. Create an edition to print it." };
  });
}

export async function createEditionAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, chartId }) => {
    const ed = await createEdition(caller, { chartId });
    refresh(slug);
    if (ed.reused) return { ok: true, message: `Edition ${ed.number} is already a draft with exactly this content.` };
    return { ok: true, message: `Edition ${ed.number} created as a draft. Someone other than you must approve it.` };
  });
}

export async function approveEditionAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, editionId, reviewed }) => {
    const ed = await approveEdition(caller, { editionId }, { reviewed });
    refresh(slug);
    const superseded = ed.superseded.length ? ` Edition ${ed.superseded.join(", ")} is now superseded.` : "";
    return { ok: true, message: `Edition ${ed.number} approved.${superseded}` };
  });
}

export async function rejectEditionAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, editionId, reason }) => {
    const ed = await rejectEdition(caller, { editionId }, { reason });
    refresh(slug);
    return { ok: true, message: `Edition ${ed.number} sent back with your reason; it can no longer be approved.` };
  });
}

export async function withdrawEditionAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, editionId, reason }) => {
    const ed = await withdrawEdition(caller, { editionId }, { reason });
    refresh(slug);
    return { ok: true, message: `Edition ${ed.number} withdrawn.` };
  });
}

/** The lab logo printed on `chartId`'s posters: a PNG or JPEG in `file`. */
export async function setChartLogoAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, chartId }) => {
    // Read only after the operation has checked the role.
    const file = () => uploadedFile(payload, { maxBytes: LOGO_MAX_BYTES, tooLargeHint: LOGO_TOO_LARGE_HINT });
    await setChartLogo(caller, { chartId }, { file });
    refresh(slug);
    return { ok: true, message: "Logo saved. New editions will print it." };
  });
}

export async function removeChartLogoAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, chartId }) => {
    await removeChartLogo(caller, { chartId });
    refresh(slug);
    return { ok: true, message: "Logo removed." };
  });
}

/** Archives `chartId` (managers and the medical lead): it leaves the lists and its posted copies read take-down. */
export async function archiveChartAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, chartId }) => {
    const r = await archiveChart(caller, { chartId });
    refresh(slug);
    revalidatePath(`/labs/${String(slug)}`);
    return { ok: true, message: `"${r.title}" is archived. Its posted copies now read "take down".` };
  });
}

/** Restores an archived `chartId` (managers and the medical lead): back in the lists; its copies read what they are. */
export async function restoreChartAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, chartId }) => {
    const r = await restoreChart(caller, { chartId });
    refresh(slug);
    revalidatePath(`/labs/${String(slug)}`);
    return {
      ok: true,
      message: `"${r.title}" is restored. Its posted copies' check pages say again whether they are current.`,
    };
  });
}
