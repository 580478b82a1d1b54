import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { buildSnapshot, type LabStock, type Snapshot } from "@/lib/charts/snapshot";
import { AppError, notFound } from "@/lib/errors";
import { chartDefinitionSchema, type ChartDefinition } from "@/lib/validation/chart";
import { db, type Database } from "../index";
import { balloonFamilies, balloons, charts, editions, labs, logos, stentPlatforms, stentSizes, users } from "../schema";
import { recordAudit, type Tx } from "./audit";

type Conn = Tx | Database;

/** Serialises writes that change what a lab's charts would print (stock, charts, editions). */
export async function lockLab(tx: Tx, labId: number): Promise<{ name: string; stockRevision: number }> {
  const [row] = await tx.select({ name: labs.name, stockRevision: labs.stockRevision }).from(labs).where(eq(labs.id, labId)).for("update");
  if (!row) throw notFound("Lab");
  return row;
}

export async function loadLabStock(conn: Conn, labId: number): Promise<LabStock> {
  const fams = await conn.select().from(balloonFamilies).where(eq(balloonFamilies.labId, labId)).orderBy(asc(balloonFamilies.name));
  const bals = await conn.select().from(balloons).where(eq(balloons.labId, labId)).orderBy(asc(balloons.diameterMm));
  const plats = await conn.select().from(stentPlatforms).where(eq(stentPlatforms.labId, labId)).orderBy(asc(stentPlatforms.name));
  const sizes = await conn.select().from(stentSizes).where(eq(stentSizes.labId, labId)).orderBy(asc(stentSizes.nominalMm));
  return {
    balloonFamilies: fams.map((f) => ({
      id: f.id,
      name: f.name,
      compliance: f.compliance,
      nominalAtm: f.nominalAtm,
      rbpAtm: f.rbpAtm,
      growthAtRbpMm: f.growthAtRbpMm,
      balloons: bals.filter((b) => b.familyId === f.id).map((b) => ({ id: b.id, diameterMm: b.diameterMm, inStock: b.inStock })),
    })),
    stentPlatforms: plats.map((p) => ({
      id: p.id,
      name: p.name,
      sizes: sizes.filter((s) => s.platformId === p.id).map((s) => ({ id: s.id, nominalMm: s.nominalMm, maxPostDilatationMm: s.maxPostDilatationMm })),
    })),
  };
}

export function parseDefinition(raw: unknown): ChartDefinition {
  const parsed = chartDefinitionSchema.safeParse(raw);
  if (!parsed.success) throw new AppError("internal", "A stored chart definition no longer validates.");
  return parsed.data;
}

export type LiveChange = { chartId: number; before: string | null; after: string };

/**
 * The one pass per lab: resolves every chart of the lab against today's stock and settings and
 * stores what an edition made now would freeze. Runs inside the transaction of the change that
 * caused it, so every app instance reads a consistent answer from the database.
 */
export async function refreshLiveSnapshots(tx: Tx, labId: number): Promise<LiveChange[]> {
  const lab = await lockLab(tx, labId);
  const stock = await loadLabStock(tx, labId);
  const rows = await tx
    .select({ id: charts.id, definition: charts.definition, liveFingerprint: charts.liveFingerprint, logoSha256: logos.sha256 })
    .from(charts)
    .leftJoin(logos, eq(logos.id, charts.logoId))
    .where(eq(charts.labId, labId));
  const changed: LiveChange[] = [];
  for (const row of rows) {
    const snapshot = buildSnapshot({ labName: lab.name, definition: parseDefinition(row.definition), stock, logoSha256: row.logoSha256 ?? null });
    const fingerprint = fingerprintOf(snapshot);
    if (fingerprint === row.liveFingerprint) continue;
    await tx.update(charts).set({ liveFingerprint: fingerprint, liveSnapshot: snapshot }).where(and(eq(charts.id, row.id), eq(charts.labId, labId)));
    changed.push({ chartId: row.id, before: row.liveFingerprint, after: fingerprint });
  }
  return changed;
}

export async function createChart({ labId, userId, definition, logoId = null }: { labId: number; userId: number; definition: ChartDefinition; logoId?: number | null }) {
  return db.transaction(async (tx) => {
    await lockLab(tx, labId);
    await assertStockRefs(tx, labId, definition);
    const [row] = await tx.insert(charts).values({ labId, title: definition.title, definition, logoId, createdBy: userId, updatedAt: new Date() }).$returningId();
    const changes = await refreshLiveSnapshots(tx, labId);
    await recordAudit({ tx, labId, actorUserId: userId, action: "chart.created", targetType: "chart", targetId: row!.id, detail: { after: definition } });
    return { id: row!.id, changes };
  });
}

export async function updateChart({
  labId,
  chartId,
  userId,
  definition,
  logoId,
}: {
  labId: number;
  chartId: number;
  userId: number;
  definition: ChartDefinition;
  logoId?: number | null;
}) {
  return db.transaction(async (tx) => {
    await lockLab(tx, labId);
    const [before] = await tx.select().from(charts).where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
    if (!before) throw notFound("Chart");
    await assertStockRefs(tx, labId, definition);
    await tx
      .update(charts)
      .set({ title: definition.title, definition, updatedAt: new Date(), ...(logoId !== undefined ? { logoId } : {}) })
      .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
    const changes = await refreshLiveSnapshots(tx, labId);
    await recordAudit({ tx, labId, actorUserId: userId, action: "chart.updated", targetType: "chart", targetId: chartId, detail: { before: before.definition, after: definition } });
    return { changes };
  });
}

/** A chart may only point at this lab's own balloon families and stent platforms. */
async function assertStockRefs(tx: Tx, labId: number, def: ChartDefinition) {
  const familyIds = [...new Set(def.lookups.map((l) => l.familyId))];
  const found = await tx
    .select({ id: balloonFamilies.id })
    .from(balloonFamilies)
    .where(and(eq(balloonFamilies.labId, labId), inArray(balloonFamilies.id, familyIds)));
  const missing = def.lookups.map((l, i) => ({ l, i })).filter(({ l }) => !found.some((f) => f.id === l.familyId));
  if (missing.length)
    throw new AppError(
      "invalid_input",
      "Choose a balloon family of this lab for every lookup.",
      missing.map(({ i }) => ({ path: ["lookups", i, "familyId"], message: "No such balloon family in this lab" })),
    );
  if (def.stentPlatformId) {
    const [p] = await tx.select({ id: stentPlatforms.id }).from(stentPlatforms).where(and(eq(stentPlatforms.labId, labId), eq(stentPlatforms.id, def.stentPlatformId)));
    if (!p) throw new AppError("invalid_input", "Choose a stent platform of this lab, or none.", [{ path: ["stentPlatformId"], message: "No such stent platform in this lab" }]);
  }
}

export async function getChart({ labId, chartId }: { labId: number; chartId: number }) {
  const [row] = await db.select().from(charts).where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  if (!row) return null;
  return { ...row, definition: parseDefinition(row.definition), liveSnapshot: row.liveSnapshot as Snapshot | null };
}

/** A chart's lab, for routes addressed by chart id (the guard then checks membership). */
export async function findChartLab({ chartId }: { chartId: number }) {
  const [row] = await db.select({ labId: charts.labId }).from(charts).where(eq(charts.id, chartId));
  return row?.labId ?? null;
}

/** Charts with their current edition: the newest approved, else the newest draft. */
export async function listCharts({ labId }: { labId: number }) {
  const chartRows = await db.select().from(charts).where(eq(charts.labId, labId)).orderBy(asc(charts.title));
  const eds = await db
    .select({
      id: editions.id,
      chartId: editions.chartId,
      number: editions.number,
      status: editions.status,
      fingerprint: editions.fingerprint,
      checkToken: editions.checkToken,
      approvedAt: editions.approvedAt,
      approvedByName: editions.approvedByName,
      createdAt: editions.createdAt,
      createdByName: users.name,
    })
    .from(editions)
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(eq(editions.labId, labId))
    .orderBy(desc(editions.number));
  return chartRows.map((c) => {
    const mine = eds.filter((e) => e.chartId === c.id);
    const current = mine.find((e) => e.status === "approved") ?? mine.find((e) => e.status === "draft") ?? null;
    return { chart: { ...c, definition: parseDefinition(c.definition) }, current, editions: mine };
  });
}
