import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { AppError } from "@/lib/errors";
import { csvIssuesError, type CsvRow, type StentCsvRow } from "@/lib/stock/csv";
import {
  isEmptyPlan,
  planStockImport,
  summarisePlan,
  type ImportPlan,
  type ImportResult,
} from "@/lib/stock/import-plan";
import type { BalloonFamilyView, StentPlatformView } from "@/lib/stock/types";
import { balloonFamilies, balloons, stentPlatforms, stentSizes } from "../schema";
import type { Tx } from "./audit";
import { commit, currentRevision, familyValues, getStock, type Actor } from "./stock";
import { readFamilies, readPlatforms } from "./stock-read";

const CHUNK = 1000;

/** Balloon lines, and stent lines (none for a balloon-only import). */
export type StockRows = { rows: CsvRow[]; stentRows?: StentCsvRow[] };

/** Plans a checked stock CSV against the current stock, changing nothing (the import preview). */
export async function previewStockImport({
  labId,
  rows,
  stentRows = [],
}: { labId: number } & StockRows): Promise<ImportResult> {
  const stock = await getStock({ labId });
  const { plan, issues } = planStockImport(stock, { rows, stentRows });
  if (issues.length) throw csvIssuesError(issues);
  return { dryRun: true, applied: false, revision: stock.revision, summary: summarisePlan(plan), plan };
}

async function applyBalloons(tx: Tx, labId: number, plan: ImportPlan): Promise<Set<number>> {
  const newIds = new Map<string, number>();
  for (const fam of plan.familiesToAdd) {
    const [row] = await tx
      .insert(balloonFamilies)
      .values({
        labId,
        name: fam.name,
        compliance: fam.compliance,
        nominalAtm: fam.nominalAtm,
        rbpAtm: fam.rbpAtm,
        growthAtRbpMm: fam.growthAtRbpMm,
      })
      .$returningId();
    newIds.set(fam.name, row!.id);
  }
  for (const change of plan.familiesToChange) {
    const { compliance, nominalAtm, rbpAtm, growthAtRbpMm } = change.after;
    await tx
      .update(balloonFamilies)
      .set({ compliance, nominalAtm, rbpAtm, growthAtRbpMm })
      .where(and(eq(balloonFamilies.labId, labId), eq(balloonFamilies.id, change.id)));
  }
  const inserts = plan.balloonsToAdd.map((b) => ({
    labId,
    familyId: b.familyId ?? newIds.get(b.family)!,
    diameterMm: b.diameterMm,
    inStock: b.inStock,
  }));
  for (let i = 0; i < inserts.length; i += CHUNK) await tx.insert(balloons).values(inserts.slice(i, i + CHUNK));
  const setStock = async (ids: number[], inStock: boolean) => {
    for (let i = 0; i < ids.length; i += CHUNK) {
      await tx
        .update(balloons)
        .set({ inStock })
        .where(and(eq(balloons.labId, labId), inArray(balloons.id, ids.slice(i, i + CHUNK))));
    }
  };
  await setStock(
    plan.balloonsToChange.filter((b) => b.after.inStock).map((b) => b.id),
    true,
  );
  await setStock(
    [
      ...plan.balloonsToChange.filter((b) => !b.after.inStock).map((b) => b.id),
      ...plan.balloonsToMarkOutOfStock.map((b) => b.id),
    ],
    false,
  );
  return new Set<number>([
    ...newIds.values(),
    ...plan.familiesToChange.map((c) => c.id),
    ...plan.balloonsToAdd.flatMap((b) => (b.familyId ? [b.familyId] : [])),
    ...plan.balloonsToChange.map((b) => b.familyId),
    ...plan.balloonsToMarkOutOfStock.map((b) => b.familyId),
  ]);
}

async function applyStents(tx: Tx, labId: number, plan: ImportPlan): Promise<Set<number>> {
  const newIds = new Map<string, number>();
  for (const plat of plan.platformsToAdd) {
    const [row] = await tx.insert(stentPlatforms).values({ labId, name: plat.name }).$returningId();
    newIds.set(plat.name, row!.id);
  }
  const inserts = plan.stentSizesToAdd.map((s) => ({
    labId,
    platformId: s.platformId ?? newIds.get(s.platform)!,
    nominalMm: s.nominalMm,
    maxPostDilatationMm: s.maxPostDilatationMm,
  }));
  for (let i = 0; i < inserts.length; i += CHUNK) await tx.insert(stentSizes).values(inserts.slice(i, i + CHUNK));
  for (const change of plan.stentSizesToChange)
    await tx
      .update(stentSizes)
      .set({ maxPostDilatationMm: change.after.maxPostDilatationMm })
      .where(and(eq(stentSizes.labId, labId), eq(stentSizes.id, change.id)));
  const removed = plan.stentSizesToRemove.map((s) => s.id);
  for (let i = 0; i < removed.length; i += CHUNK)
    await tx
      .delete(stentSizes)
      .where(and(eq(stentSizes.labId, labId), inArray(stentSizes.id, removed.slice(i, i + CHUNK))));
  return new Set<number>([
    ...newIds.values(),
    ...plan.stentSizesToAdd.flatMap((s) => (s.platformId ? [s.platformId] : [])),
    ...plan.stentSizesToChange.map((s) => s.platformId),
    ...plan.stentSizesToRemove.map((s) => s.platformId),
  ]);
}

const familySnapshot = (fams: BalloonFamilyView[], touched: Set<number>) =>
  fams
    .filter((f) => touched.has(f.id))
    .map((f) => ({
      ...familyValues(f),
      balloons: f.balloons.map(({ diameterMm, inStock }) => ({ diameterMm, inStock })),
    }));
const platformSnapshot = (plats: StentPlatformView[], touched: Set<number>) =>
  plats
    .filter((p) => touched.has(p.id))
    .map((p) => ({
      name: p.name,
      sizes: p.sizes.map(({ nominalMm, maxPostDilatationMm }) => ({ nominalMm, maxPostDilatationMm })),
    }));

/**
 * Applies a checked stock CSV as one change (one audit event, one revision bump). Any bad line
 * refuses the whole file.
 */
export async function importStock(
  tx: Tx,
  {
    labId,
    actorUserId,
    actorTokenId,
    rows,
    stentRows = [],
    expectRevision,
    fileName,
  }: Actor & StockRows & { expectRevision?: number; fileName?: string },
): Promise<ImportResult> {
  const revisionNow = await currentRevision(tx, labId);
  if (expectRevision !== undefined && expectRevision !== revisionNow) {
    throw new AppError(
      "conflict",
      `The stock changed since this file was previewed (revision ${expectRevision}, now ${revisionNow}). Preview the file again before applying it.`,
    );
  }
  const current = { balloonFamilies: await readFamilies(tx, labId), stentPlatforms: await readPlatforms(tx, labId) };
  const { plan, issues } = planStockImport(current, { rows, stentRows });
  if (issues.length) throw csvIssuesError(issues);
  const summary = summarisePlan(plan);
  if (isEmptyPlan(plan)) return { dryRun: false, applied: false, revision: revisionNow, summary, plan };

  const families = await applyBalloons(tx, labId, plan);
  const platforms = await applyStents(tx, labId, plan);
  const afterFamilies = await readFamilies(tx, labId, [...families]);
  const afterPlatforms = await readPlatforms(tx, labId, [...platforms]);
  // Balloon-only imports keep the audit detail they always had.
  const stentPart = (plats: StentPlatformView[]) =>
    platforms.size ? { platforms: platformSnapshot(plats, platforms) } : {};
  const revision = await commit(
    tx,
    { labId, actorUserId, actorTokenId },
    {
      action: "stock.import",
      targetType: "lab",
      targetId: labId,
      summary: `Imported ${fileName ? `${fileName}: ` : ""}${summary}`,
      before: { families: familySnapshot(current.balloonFamilies, families), ...stentPart(current.stentPlatforms) },
      after: { families: familySnapshot(afterFamilies, families), ...stentPart(afterPlatforms) },
    },
  );
  return { dryRun: false, applied: true, revision, summary, plan };
}
