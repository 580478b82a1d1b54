import "server-only";
import { and, desc, eq, like, lt, ne, sql } from "drizzle-orm";
import { AppError, invalidInput, notFound } from "@/lib/errors";
import { formatMm } from "@/lib/stock/format";
import type { BalloonFamilyView, FamilyValues, StentPlatformView, StockView } from "@/lib/stock/types";
import {
  balloonFamilyInput,
  stentSizeInput,
  type BalloonFamilyInput,
  type BalloonFamilyPatch,
  type BalloonInput,
  type BalloonPatch,
  type StentPlatformInput,
  type StentSizeInput,
  type StentSizePatch,
} from "@/lib/validation/stock";
import { db } from "../index";
import { auditEvents, balloonFamilies, balloons, labs, labTokens, stentPlatforms, stentSizes, users } from "../schema";
import { actorNameSql, recordAudit, type Tx } from "./audit";
import { afterLabChange } from "./lab-changes";
import { readFamilies, readPlatforms } from "./stock-read";

/** Who a stock write is audited under: a person, or the lab's machine token (lib/auth/machine-tokens.ts). */
export type Actor = { labId: number; actorUserId: number | null; actorTokenId?: number | null };

export type StockChange = { labId: number; actorUserId: number | null; summary: string };

/**
 * The one hook every stock write calls inside its transaction, after its rows changed.
 * Today it bumps labs.stock_revision; work that derives from stock (chart fingerprints) joins here
 * so it commits or rolls back with the change. Returns the new revision.
 */
export async function afterStockChange(tx: Tx, change: StockChange): Promise<number> {
  await tx
    .update(labs)
    .set({ stockRevision: sql`${labs.stockRevision} + 1` })
    .where(eq(labs.id, change.labId));
  const [row] = await tx.select({ revision: labs.stockRevision }).from(labs).where(eq(labs.id, change.labId));
  if (!row) throw notFound("Lab");
  await afterLabChange(tx, { labId: change.labId, changeKey: `stock:${row.revision}`, cause: change.summary });
  return row.revision;
}

// ---------- reading ----------

/** The lab's whole stock: families by name with balloons by diameter, platforms by name with sizes by nominal. */
export async function getStock({ labId }: { labId: number }): Promise<StockView> {
  return db.transaction(async (tx) => {
    const [lab] = await tx.select({ revision: labs.stockRevision }).from(labs).where(eq(labs.id, labId));
    if (!lab) throw notFound("Lab");
    const [balloonFamilies, stentPlatforms] = [await readFamilies(tx, labId), await readPlatforms(tx, labId)];
    return { revision: lab.revision, balloonFamilies, stentPlatforms };
  });
}

/** Stock audit events, newest first, with who made them. */
export async function listStockHistory({
  labId,
  before,
  limit = 30,
}: {
  labId: number;
  before?: number;
  limit?: number;
}) {
  const scope = and(eq(auditEvents.labId, labId), like(auditEvents.action, "stock.%"));
  return db
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      targetType: auditEvents.targetType,
      targetId: auditEvents.targetId,
      detail: auditEvents.detail,
      createdAt: auditEvents.createdAt,
      actorName: actorNameSql,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .leftJoin(labTokens, eq(labTokens.id, auditEvents.actorTokenId))
    .where(before ? and(scope, lt(auditEvents.id, before)) : scope)
    .orderBy(desc(auditEvents.id))
    .limit(Math.min(Math.max(limit, 1), 100));
}

// ---------- writes: each runs inside the lab write transaction of lib/ops (lab row locked) ----------

type Committed = {
  action: string;
  targetType: string;
  targetId: number;
  summary: string;
  before: unknown;
  after: unknown;
};

export async function commit(tx: Tx, actor: Actor, change: Committed): Promise<number> {
  const revision = await afterStockChange(tx, {
    labId: actor.labId,
    actorUserId: actor.actorUserId,
    summary: change.summary,
  });
  await recordAudit({
    tx,
    labId: actor.labId,
    actorUserId: actor.actorUserId,
    actorTokenId: actor.actorTokenId ?? null,
    action: change.action,
    targetType: change.targetType,
    targetId: change.targetId,
    detail: { summary: change.summary, revision, before: change.before, after: change.after },
  });
  return revision;
}

export async function currentRevision(tx: Tx, labId: number): Promise<number> {
  const [row] = await tx.select({ revision: labs.stockRevision }).from(labs).where(eq(labs.id, labId));
  return row!.revision;
}

const mm = (v: number) => `${formatMm(v)} mm`;
export const familyValues = (f: FamilyValues): FamilyValues => ({
  name: f.name,
  compliance: f.compliance,
  nominalAtm: f.nominalAtm,
  rbpAtm: f.rbpAtm,
  growthAtRbpMm: f.growthAtRbpMm ?? null,
});
const sameValues = (a: object, b: object) => JSON.stringify(a) === JSON.stringify(b);

// ---------- balloon families ----------

async function findFamily(tx: Tx, labId: number, familyId: number): Promise<BalloonFamilyView> {
  const [family] = await readFamilies(tx, labId, [familyId]);
  if (!family) throw notFound("Balloon family");
  return family;
}

async function assertFamilyNameFree(tx: Tx, labId: number, name: string, exceptId?: number) {
  const where = and(
    eq(balloonFamilies.labId, labId),
    eq(balloonFamilies.name, name),
    exceptId ? ne(balloonFamilies.id, exceptId) : undefined,
  );
  const [clash] = await tx.select({ name: balloonFamilies.name }).from(balloonFamilies).where(where);
  if (clash)
    throw new AppError("conflict", `This lab already has a balloon family named "${clash.name}".`, [
      { path: ["name"], message: "A family with this name already exists." },
    ]);
}

export async function createBalloonFamily(
  tx: Tx,
  { labId, actorUserId, actorTokenId, input }: Actor & { input: BalloonFamilyInput },
) {
  await assertFamilyNameFree(tx, labId, input.name);
  const values = familyValues({ ...input, growthAtRbpMm: input.growthAtRbpMm ?? null });
  const [row] = await tx
    .insert(balloonFamilies)
    .values({ labId, ...values })
    .$returningId();
  const family = await findFamily(tx, labId, row!.id);
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.family.create",
      targetType: "balloon_family",
      targetId: family.id,
      summary: `Added balloon family ${family.name}`,
      before: null,
      after: familyValues(family),
    },
  );
  return { revision, family };
}

export async function updateBalloonFamily(
  tx: Tx,
  { labId, actorUserId, actorTokenId, familyId, patch }: Actor & { familyId: number; patch: BalloonFamilyPatch },
) {
  const current = await findFamily(tx, labId, familyId);
  const before = familyValues(current);
  const merged = balloonFamilyInput.safeParse({ ...before, ...patch });
  if (!merged.success) throw invalidInput(merged.error.issues);
  const after = familyValues({ ...merged.data, growthAtRbpMm: merged.data.growthAtRbpMm ?? null });
  if (sameValues(before, after)) return { revision: await currentRevision(tx, labId), family: current, changed: false };
  if (after.name !== before.name) await assertFamilyNameFree(tx, labId, after.name, familyId);
  await tx
    .update(balloonFamilies)
    .set(after)
    .where(and(eq(balloonFamilies.labId, labId), eq(balloonFamilies.id, familyId)));
  const family = await findFamily(tx, labId, familyId);
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.family.update",
      targetType: "balloon_family",
      targetId: familyId,
      summary: `Changed balloon family ${after.name}`,
      before,
      after: familyValues(family),
    },
  );
  return { revision, family, changed: true };
}

export async function deleteBalloonFamily(
  tx: Tx,
  { labId, actorUserId, actorTokenId, familyId }: Actor & { familyId: number },
) {
  const current = await findFamily(tx, labId, familyId);
  await tx.delete(balloons).where(and(eq(balloons.labId, labId), eq(balloons.familyId, familyId)));
  await tx.delete(balloonFamilies).where(and(eq(balloonFamilies.labId, labId), eq(balloonFamilies.id, familyId)));
  const before = {
    ...familyValues(current),
    balloons: current.balloons.map(({ diameterMm, inStock }) => ({ diameterMm, inStock })),
  };
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.family.delete",
      targetType: "balloon_family",
      targetId: familyId,
      summary: `Deleted balloon family ${current.name} and its ${current.balloons.length} sizes`,
      before,
      after: null,
    },
  );
  return { revision, deleted: { id: familyId } };
}

// ---------- balloons ----------

async function findBalloon(tx: Tx, labId: number, balloonId: number) {
  const [row] = await tx
    .select({
      id: balloons.id,
      familyId: balloons.familyId,
      family: balloonFamilies.name,
      diameterMm: balloons.diameterMm,
      inStock: balloons.inStock,
    })
    .from(balloons)
    .innerJoin(balloonFamilies, eq(balloonFamilies.id, balloons.familyId))
    .where(and(eq(balloons.labId, labId), eq(balloons.id, balloonId)));
  if (!row) throw notFound("Balloon");
  return row;
}

async function assertDiameterFree(tx: Tx, familyId: number, familyName: string, diameterMm: number, exceptId?: number) {
  const where = and(
    eq(balloons.familyId, familyId),
    eq(balloons.diameterMm, diameterMm),
    exceptId ? ne(balloons.id, exceptId) : undefined,
  );
  const [clash] = await tx.select({ id: balloons.id }).from(balloons).where(where);
  if (clash)
    throw new AppError("conflict", `${familyName} already has a ${mm(diameterMm)} balloon.`, [
      { path: ["diameterMm"], message: "This family already has this diameter." },
    ]);
}

const balloonView = (b: { id: number; diameterMm: number; inStock: boolean }) => ({
  id: b.id,
  diameterMm: b.diameterMm,
  inStock: b.inStock,
});

export async function createBalloon(
  tx: Tx,
  { labId, actorUserId, actorTokenId, familyId, input }: Actor & { familyId: number; input: BalloonInput },
) {
  const family = await findFamily(tx, labId, familyId);
  await assertDiameterFree(tx, familyId, family.name, input.diameterMm);
  const [row] = await tx
    .insert(balloons)
    .values({ labId, familyId, diameterMm: input.diameterMm, inStock: input.inStock })
    .$returningId();
  const balloon = await findBalloon(tx, labId, row!.id);
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.balloon.create",
      targetType: "balloon",
      targetId: balloon.id,
      summary: `Added ${mm(balloon.diameterMm)} to ${family.name}${balloon.inStock ? "" : " (out of stock)"}`,
      before: null,
      after: { family: family.name, diameterMm: balloon.diameterMm, inStock: balloon.inStock },
    },
  );
  return { revision, balloon: balloonView(balloon) };
}

export async function updateBalloon(
  tx: Tx,
  { labId, actorUserId, actorTokenId, balloonId, patch }: Actor & { balloonId: number; patch: BalloonPatch },
) {
  const current = await findBalloon(tx, labId, balloonId);
  const before = { family: current.family, diameterMm: current.diameterMm, inStock: current.inStock };
  const after = { ...before, ...patch };
  if (sameValues(before, after))
    return { revision: await currentRevision(tx, labId), balloon: balloonView(current), changed: false };
  if (after.diameterMm !== before.diameterMm)
    await assertDiameterFree(tx, current.familyId, current.family, after.diameterMm, balloonId);
  await tx
    .update(balloons)
    .set({ diameterMm: after.diameterMm, inStock: after.inStock })
    .where(and(eq(balloons.labId, labId), eq(balloons.id, balloonId)));
  const summary =
    after.diameterMm === before.diameterMm
      ? `Marked ${current.family} ${mm(current.diameterMm)} ${after.inStock ? "in stock" : "out of stock"}`
      : `Changed ${current.family} ${mm(before.diameterMm)} to ${mm(after.diameterMm)}${after.inStock === before.inStock ? "" : after.inStock ? ", in stock" : ", out of stock"}`;
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    { action: "stock.balloon.update", targetType: "balloon", targetId: balloonId, summary, before, after },
  );
  return { revision, balloon: balloonView({ id: balloonId, ...after }), changed: true };
}

export async function deleteBalloon(
  tx: Tx,
  { labId, actorUserId, actorTokenId, balloonId }: Actor & { balloonId: number },
) {
  const current = await findBalloon(tx, labId, balloonId);
  await tx.delete(balloons).where(and(eq(balloons.labId, labId), eq(balloons.id, balloonId)));
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.balloon.delete",
      targetType: "balloon",
      targetId: balloonId,
      summary: `Removed ${mm(current.diameterMm)} from ${current.family}`,
      before: { family: current.family, diameterMm: current.diameterMm, inStock: current.inStock },
      after: null,
    },
  );
  return { revision, deleted: { id: balloonId } };
}

// ---------- stent platforms ----------

async function findPlatform(tx: Tx, labId: number, platformId: number): Promise<StentPlatformView> {
  const [platform] = await readPlatforms(tx, labId, [platformId]);
  if (!platform) throw notFound("Stent platform");
  return platform;
}

async function assertPlatformNameFree(tx: Tx, labId: number, name: string, exceptId?: number) {
  const where = and(
    eq(stentPlatforms.labId, labId),
    eq(stentPlatforms.name, name),
    exceptId ? ne(stentPlatforms.id, exceptId) : undefined,
  );
  const [clash] = await tx.select({ name: stentPlatforms.name }).from(stentPlatforms).where(where);
  if (clash)
    throw new AppError("conflict", `This lab already has a stent platform named "${clash.name}".`, [
      { path: ["name"], message: "A platform with this name already exists." },
    ]);
}

export async function createStentPlatform(
  tx: Tx,
  { labId, actorUserId, actorTokenId, input }: Actor & { input: StentPlatformInput },
) {
  await assertPlatformNameFree(tx, labId, input.name);
  const [row] = await tx.insert(stentPlatforms).values({ labId, name: input.name }).$returningId();
  const platform = await findPlatform(tx, labId, row!.id);
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.platform.create",
      targetType: "stent_platform",
      targetId: platform.id,
      summary: `Added stent platform ${platform.name}`,
      before: null,
      after: { name: platform.name },
    },
  );
  return { revision, platform };
}

export async function updateStentPlatform(
  tx: Tx,
  { labId, actorUserId, actorTokenId, platformId, input }: Actor & { platformId: number; input: StentPlatformInput },
) {
  const current = await findPlatform(tx, labId, platformId);
  if (current.name === input.name)
    return { revision: await currentRevision(tx, labId), platform: current, changed: false };
  await assertPlatformNameFree(tx, labId, input.name, platformId);
  await tx
    .update(stentPlatforms)
    .set({ name: input.name })
    .where(and(eq(stentPlatforms.labId, labId), eq(stentPlatforms.id, platformId)));
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.platform.update",
      targetType: "stent_platform",
      targetId: platformId,
      summary: `Renamed stent platform ${current.name} to ${input.name}`,
      before: { name: current.name },
      after: { name: input.name },
    },
  );
  return { revision, platform: { ...current, name: input.name }, changed: true };
}

export async function deleteStentPlatform(
  tx: Tx,
  { labId, actorUserId, actorTokenId, platformId }: Actor & { platformId: number },
) {
  const current = await findPlatform(tx, labId, platformId);
  await tx.delete(stentSizes).where(and(eq(stentSizes.labId, labId), eq(stentSizes.platformId, platformId)));
  await tx.delete(stentPlatforms).where(and(eq(stentPlatforms.labId, labId), eq(stentPlatforms.id, platformId)));
  const before = {
    name: current.name,
    sizes: current.sizes.map(({ nominalMm, maxPostDilatationMm }) => ({ nominalMm, maxPostDilatationMm })),
  };
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.platform.delete",
      targetType: "stent_platform",
      targetId: platformId,
      summary: `Deleted stent platform ${current.name} and its ${current.sizes.length} sizes`,
      before,
      after: null,
    },
  );
  return { revision, deleted: { id: platformId } };
}

// ---------- stent sizes ----------

async function findSize(tx: Tx, labId: number, sizeId: number) {
  const [row] = await tx
    .select({
      id: stentSizes.id,
      platformId: stentSizes.platformId,
      platform: stentPlatforms.name,
      nominalMm: stentSizes.nominalMm,
      maxPostDilatationMm: stentSizes.maxPostDilatationMm,
    })
    .from(stentSizes)
    .innerJoin(stentPlatforms, eq(stentPlatforms.id, stentSizes.platformId))
    .where(and(eq(stentSizes.labId, labId), eq(stentSizes.id, sizeId)));
  if (!row) throw notFound("Stent size");
  return row;
}

async function assertNominalFree(
  tx: Tx,
  platformId: number,
  platformName: string,
  nominalMm: number,
  exceptId?: number,
) {
  const where = and(
    eq(stentSizes.platformId, platformId),
    eq(stentSizes.nominalMm, nominalMm),
    exceptId ? ne(stentSizes.id, exceptId) : undefined,
  );
  const [clash] = await tx.select({ id: stentSizes.id }).from(stentSizes).where(where);
  if (clash)
    throw new AppError("conflict", `${platformName} already has a ${mm(nominalMm)} size.`, [
      { path: ["nominalMm"], message: "This platform already has this nominal diameter." },
    ]);
}

const sizeView = (s: { id: number; nominalMm: number; maxPostDilatationMm: number }) => ({
  id: s.id,
  nominalMm: s.nominalMm,
  maxPostDilatationMm: s.maxPostDilatationMm,
});

export async function createStentSize(
  tx: Tx,
  { labId, actorUserId, actorTokenId, platformId, input }: Actor & { platformId: number; input: StentSizeInput },
) {
  const platform = await findPlatform(tx, labId, platformId);
  await assertNominalFree(tx, platformId, platform.name, input.nominalMm);
  const [row] = await tx
    .insert(stentSizes)
    .values({ labId, platformId, nominalMm: input.nominalMm, maxPostDilatationMm: input.maxPostDilatationMm })
    .$returningId();
  const size = await findSize(tx, labId, row!.id);
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.size.create",
      targetType: "stent_size",
      targetId: size.id,
      summary: `Added ${mm(size.nominalMm)} (post-dilatation up to ${mm(size.maxPostDilatationMm)}) to ${platform.name}`,
      before: null,
      after: { platform: platform.name, nominalMm: size.nominalMm, maxPostDilatationMm: size.maxPostDilatationMm },
    },
  );
  return { revision, size: sizeView(size) };
}

export async function updateStentSize(
  tx: Tx,
  { labId, actorUserId, actorTokenId, sizeId, patch }: Actor & { sizeId: number; patch: StentSizePatch },
) {
  const current = await findSize(tx, labId, sizeId);
  const merged = stentSizeInput.safeParse({
    nominalMm: current.nominalMm,
    maxPostDilatationMm: current.maxPostDilatationMm,
    ...patch,
  });
  if (!merged.success) throw invalidInput(merged.error.issues);
  const before = {
    platform: current.platform,
    nominalMm: current.nominalMm,
    maxPostDilatationMm: current.maxPostDilatationMm,
  };
  const after = { platform: current.platform, ...merged.data };
  if (sameValues(before, after))
    return { revision: await currentRevision(tx, labId), size: sizeView(current), changed: false };
  if (after.nominalMm !== before.nominalMm)
    await assertNominalFree(tx, current.platformId, current.platform, after.nominalMm, sizeId);
  await tx
    .update(stentSizes)
    .set(merged.data)
    .where(and(eq(stentSizes.labId, labId), eq(stentSizes.id, sizeId)));
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.size.update",
      targetType: "stent_size",
      targetId: sizeId,
      summary: `Changed ${current.platform} ${mm(before.nominalMm)} size`,
      before,
      after,
    },
  );
  return { revision, size: sizeView({ id: sizeId, ...merged.data }), changed: true };
}

export async function deleteStentSize(
  tx: Tx,
  { labId, actorUserId, actorTokenId, sizeId }: Actor & { sizeId: number },
) {
  const current = await findSize(tx, labId, sizeId);
  await tx.delete(stentSizes).where(and(eq(stentSizes.labId, labId), eq(stentSizes.id, sizeId)));
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.size.delete",
      targetType: "stent_size",
      targetId: sizeId,
      summary: `Removed ${mm(current.nominalMm)} from ${current.platform}`,
      before: {
        platform: current.platform,
        nominalMm: current.nominalMm,
        maxPostDilatationMm: current.maxPostDilatationMm,
      },
      after: null,
    },
  );
  return { revision, deleted: { id: sizeId } };
}
