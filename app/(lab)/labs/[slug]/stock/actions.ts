"use server";

import { revalidatePath } from "next/cache";
import { runAction, uploadedFile, type ActionPayload, type ActionState } from "@/lib/http/action";
import * as ops from "@/lib/ops/stock";
import { impactSentence } from "@/lib/stock/impact";
import { CSV_TOO_LARGE_HINT } from "@/lib/stock/file";
import { MAX_IMPORT_BYTES } from "@/lib/stock/limits";

// Each payload names its lab (`slug`) and, to change a row, its id; the rest is the input.
const refresh = (slug: unknown) => revalidatePath(`/labs/${String(slug)}/stock`);

/** Adds a balloon family, or changes the one `familyId` names. */
export async function saveFamilyAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, familyId, ...input }) => {
    const lab = String(slug);
    const { family } = familyId
      ? await ops.updateBalloonFamily(caller, { lab, familyId }, input)
      : await ops.createBalloonFamily(caller, { lab }, input);
    refresh(slug);
    return { ok: true, message: familyId ? `Saved ${family.name}.` : `Added balloon family ${family.name}.` };
  });
}

/** Adds a size to the family `familyId`, or changes the balloon `balloonId` (e.g. its in-stock mark). */
export async function saveBalloonAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, familyId, balloonId, ...input }) => {
    const lab = String(slug);
    const { balloon } = balloonId
      ? await ops.updateBalloon(caller, { lab, balloonId }, input)
      : await ops.createBalloon(caller, { lab, familyId }, input);
    refresh(slug);
    return { ok: true, message: "Saved.", id: balloon.id };
  });
}

/** Adds a stent platform, or renames the one `platformId` names. */
export async function savePlatformAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, platformId, ...input }) => {
    const lab = String(slug);
    const { platform } = platformId
      ? await ops.updateStentPlatform(caller, { lab, platformId }, input)
      : await ops.createStentPlatform(caller, { lab }, input);
    refresh(slug);
    return {
      ok: true,
      message: platformId ? `Renamed to ${platform.name}.` : `Added stent platform ${platform.name}.`,
    };
  });
}

/** Adds a size to the platform `platformId`, or changes the stent size `sizeId`. */
export async function saveSizeAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, platformId, sizeId, ...input }) => {
    const lab = String(slug);
    const { size } = sizeId
      ? await ops.updateStentSize(caller, { lab, sizeId }, input)
      : await ops.createStentSize(caller, { lab, platformId }, input);
    refresh(slug);
    return { ok: true, message: "Saved.", id: size.id };
  });
}

export async function deleteFamilyAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, familyId }) => {
    await ops.deleteBalloonFamily(caller, { lab: String(slug), familyId });
    refresh(slug);
    return { ok: true, message: "Deleted." };
  });
}

export async function deleteBalloonAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, balloonId }) => {
    await ops.deleteBalloon(caller, { lab: String(slug), balloonId });
    refresh(slug);
    return { ok: true, message: "Deleted." };
  });
}

export async function deletePlatformAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, platformId }) => {
    await ops.deleteStentPlatform(caller, { lab: String(slug), platformId });
    refresh(slug);
    return { ok: true, message: "Deleted." };
  });
}

export async function deleteSizeAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, sizeId }) => {
    await ops.deleteStentSize(caller, { lab: String(slug), sizeId });
    refresh(slug);
    return { ok: true, message: "Deleted." };
  });
}

/** A stock CSV in `file`: `dryRun` previews (the plan in `data`); otherwise applies unless `revision` is stale. */
export async function importStockAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, dryRun, revision }) => {
    // Read only after the operation has checked the role.
    const file = () => uploadedFile(payload, { maxBytes: MAX_IMPORT_BYTES, tooLargeHint: CSV_TOO_LARGE_HINT });
    const result = await ops.importBalloonCsv(caller, { lab: String(slug) }, { dryRun, revision, file });
    if (!result.dryRun) refresh(slug);
    return { ok: true, message: result.summary, data: result };
  });
}

/** The posted copies a stock change (rows by id, or `csv`) would make outdated; writes nothing. */
export async function stockImpactAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, ...change }) => {
    const { outdates } = await ops.stockImpact(caller, { lab: String(slug) }, change);
    return { ok: true, message: impactSentence(outdates), data: { outdates } };
  });
}
