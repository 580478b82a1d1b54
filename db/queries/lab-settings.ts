import "server-only";
import { eq } from "drizzle-orm";
import { notFound } from "@/lib/errors";
import type { LabSettings, LabSettingsPatch } from "@/lib/validation/lab-settings";
import type { Database } from "../index";
import { db as defaultDb } from "../index";
import { labs } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";

const columns = {
  name: labs.name,
  timeZone: labs.timeZone,
  numberFormat: labs.numberFormat,
  contactLine: labs.contactLine,
  isDemo: labs.isDemo,
};

export async function getLabSettings(
  { labId }: { labId: number },
  tx: Tx | Database = defaultDb,
): Promise<LabSettings> {
  const [row] = await tx.select(columns).from(labs).where(eq(labs.id, labId));
  if (!row) throw notFound("Lab");
  return row;
}

/**
 * Changes some settings; the caller holds the lab lock (labWrite). Audited with only the changed
 * fields, before and after; a change that changes nothing writes nothing.
 */
export async function updateLabSettings(
  tx: Tx,
  { labId, patch, actor }: { labId: number; patch: LabSettingsPatch; actor: Actor },
): Promise<{ settings: LabSettings; changed: (keyof LabSettingsPatch)[] }> {
  const before = await getLabSettings({ labId }, tx);
  const changed = (Object.keys(patch) as (keyof LabSettingsPatch)[]).filter(
    (k) => patch[k] !== undefined && patch[k] !== before[k],
  );
  if (!changed.length) return { settings: before, changed };
  const set = Object.fromEntries(changed.map((k) => [k, patch[k]]));
  await tx.update(labs).set(set).where(eq(labs.id, labId));
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "lab.settings_updated",
    targetType: "lab",
    targetId: labId,
    detail: {
      before: Object.fromEntries(changed.map((k) => [k, before[k]])),
      after: set,
    },
  });
  return { settings: { ...before, ...set }, changed };
}
