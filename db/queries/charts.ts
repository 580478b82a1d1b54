import "server-only";
import { and, asc, desc, eq, inArray, isNotNull, isNull } from "drizzle-orm";
import { assertChartRules } from "@/lib/charts/rules";
import { checkChartAgainstRules, ruledDefinition } from "@/lib/labs/rules";
import type { Snapshot } from "@/lib/charts/snapshot";
import { AppError, notFound } from "@/lib/errors";
import { parseStoredDefinition, type ChartDefinition } from "@/lib/validation/chart";
import { db } from "../index";
import { balloonFamilies, charts, editions, logos, stentPlatforms, users } from "../schema";
import { recordAudit, type Tx } from "./audit";
import { afterLabChange } from "./lab-changes";
import { getLabRules } from "./lab-rules";
import { readStock } from "./stock-read";

export async function createChart(
  tx: Tx,
  {
    labId,
    userId,
    definition,
    logoId = null,
  }: {
    labId: number;
    userId: number;
    definition: ChartDefinition;
    logoId?: number | null;
  },
) {
  await assertStockRefs(tx, labId, definition);
  await assertLabRules(tx, labId, null, definition);
  const [row] = await tx
    .insert(charts)
    .values({ labId, title: definition.title, definition, logoId, createdBy: userId, updatedAt: new Date() })
    .$returningId();
  const changes = await afterLabChange(tx, {
    labId,
    changeKey: `chart:${row!.id}:created`,
    cause: `Chart "${definition.title}" was created`,
  });
  await recordAudit({
    tx,
    labId,
    actorUserId: userId,
    action: "chart.created",
    targetType: "chart",
    targetId: row!.id,
    detail: { after: definition },
  });
  return { id: row!.id, changes };
}

export async function updateChart(
  tx: Tx,
  {
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
  },
) {
  const [before] = await tx
    .select()
    .from(charts)
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  if (!before) throw notFound("Chart");
  await assertStockRefs(tx, labId, definition);
  await assertLabRules(tx, labId, chartId, definition);
  await tx
    .update(charts)
    .set({ title: definition.title, definition, updatedAt: new Date(), ...(logoId !== undefined ? { logoId } : {}) })
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  const changes = await afterLabChange(tx, {
    labId,
    changeKey: `chart:${chartId}:${Date.now()}`,
    cause: `Chart "${definition.title}" settings were changed`,
  });
  await recordAudit({
    tx,
    labId,
    actorUserId: userId,
    action: "chart.updated",
    targetType: "chart",
    targetId: chartId,
    detail: { before: before.definition, after: definition },
  });
  return { changes };
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
    const [p] = await tx
      .select({ id: stentPlatforms.id })
      .from(stentPlatforms)
      .where(and(eq(stentPlatforms.labId, labId), eq(stentPlatforms.id, def.stentPlatformId)));
    if (!p)
      throw new AppError("invalid_input", "Choose a stent platform of this lab, or none.", [
        { path: ["stentPlatformId"], message: "No such stent platform in this lab" },
      ]);
  }
  assertChartRules(def, await readStock(tx, labId));
}

/**
 * The lab's rules bind when a chart is created or changed, not only at approval: a breach the
 * medical lead has not excepted for this chart is refused (400) naming the rule and field.
 */
async function assertLabRules(tx: Tx, labId: number, chartId: number | null, def: ChartDefinition) {
  const { issues } = checkChartAgainstRules(chartId ?? 0, ruledDefinition(def), await getLabRules({ labId }, tx));
  if (!issues.length) return;
  const first = issues[0]!;
  throw new AppError(
    "invalid_input",
    `${first.path.join(".")}: ${first.message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ""}. Change the chart, or the medical lead records an exception for it on the rules page.`,
    issues.map((i) => ({ path: i.path, message: i.message })),
  );
}

export async function getChart({ labId, chartId }: { labId: number; chartId: number }) {
  const [row] = await db
    .select({ chart: charts, logoSha256: logos.sha256 })
    .from(charts)
    .leftJoin(logos, eq(logos.id, charts.logoId))
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  if (!row) return null;
  return {
    ...row.chart,
    logoSha256: row.logoSha256,
    definition: parseStoredDefinition(row.chart.definition),
    liveSnapshot: row.chart.liveSnapshot as Snapshot | null,
  };
}

/** A chart's lab, for routes addressed by chart id (the guard then checks membership). */
export async function findChartLab({ chartId }: { chartId: number }) {
  const [row] = await db.select({ labId: charts.labId }).from(charts).where(eq(charts.id, chartId));
  return row?.labId ?? null;
}

/** Charts with their current edition: the newest approved, else the newest draft. Archived charts only when asked. */
export async function listCharts({ labId, archived = false }: { labId: number; archived?: boolean }) {
  const chartRows = await db
    .select()
    .from(charts)
    .where(and(eq(charts.labId, labId), archived ? isNotNull(charts.archivedAt) : isNull(charts.archivedAt)))
    .orderBy(asc(charts.title));
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
    return { chart: { ...c, definition: parseStoredDefinition(c.definition) }, current, editions: mine };
  });
}

/** Sets (or, with null, removes) a chart's logo; the logo's hash is part of what editions freeze. */
export async function setChartLogo(
  tx: Tx,
  {
    labId,
    chartId,
    userId,
    logo,
  }: {
    labId: number;
    chartId: number;
    userId: number;
    logo: { bytes: Buffer; mime: string; sha256: string } | null;
  },
) {
  const [chart] = await tx
    .select({ id: charts.id, title: charts.title, logoId: charts.logoId })
    .from(charts)
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  if (!chart) throw notFound("Chart");
  if (!logo && chart.logoId === null) throw new AppError("conflict", "This chart has no logo to remove.");
  let logoId: number | null = null;
  if (logo) {
    const [existing] = await tx
      .select({ id: logos.id })
      .from(logos)
      .where(and(eq(logos.labId, labId), eq(logos.sha256, logo.sha256)));
    logoId =
      existing?.id ??
      (
        await tx.insert(logos).values({ labId, sha256: logo.sha256, mime: logo.mime, bytes: logo.bytes }).$returningId()
      )[0]!.id;
  }
  await tx
    .update(charts)
    .set({ logoId, updatedAt: new Date() })
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  await afterLabChange(tx, {
    labId,
    changeKey: `chart:${chartId}:logo:${logo?.sha256 ?? "none"}:${Date.now()}`,
    cause: `The logo on "${chart.title}" was ${logo ? "changed" : "removed"}`,
  });
  await recordAudit({
    tx,
    labId,
    actorUserId: userId,
    action: logo ? "chart.logo_set" : "chart.logo_removed",
    targetType: "chart",
    targetId: chartId,
    detail: { before: { logoId: chart.logoId }, after: { logoId, sha256: logo?.sha256 ?? null } },
  });
  return { logoId };
}

export async function getChartLogo({ labId, chartId }: { labId: number; chartId: number }) {
  const [row] = await db
    .select({ bytes: logos.bytes, mime: logos.mime, sha256: logos.sha256 })
    .from(charts)
    .innerJoin(logos, eq(logos.id, charts.logoId))
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  return row ?? null;
}

/** A chart's stored definition inside a write, so a partial change merges with what is stored now. */
export async function readChartDefinition(tx: Tx, { labId, chartId }: { labId: number; chartId: number }) {
  const [row] = await tx
    .select({ definition: charts.definition })
    .from(charts)
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  if (!row) throw notFound("Chart");
  return parseStoredDefinition(row.definition);
}

/**
 * Archives a chart (`archive: true`): it leaves the lists, keeps its editions, and every posted
 * copy of it reads take-down. Restores one (`archive: false`): back in the lists, its copies read
 * what they are. Either way the lab pass records the copies whose status changed (a stale notice,
 * or an all-clear), and each time is its own change, so a chart archived again mails again.
 * Archiving an archived chart, or restoring one that is not, is a conflict.
 */
export async function setChartArchived(
  tx: Tx,
  {
    labId,
    chartId,
    actor,
    archive,
  }: { labId: number; chartId: number; actor: { id: number; name: string }; archive: boolean },
) {
  const [chart] = await tx
    .select({ id: charts.id, title: charts.title, archivedAt: charts.archivedAt })
    .from(charts)
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)))
    .for("update");
  if (!chart) throw notFound("Chart");
  if (archive === (chart.archivedAt !== null))
    throw new AppError("conflict", `"${chart.title}" is ${archive ? "already" : "not"} archived.`);
  const now = new Date();
  const archivedAt = archive ? now : null;
  await tx
    .update(charts)
    .set({ archivedAt })
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  const verb = archive ? "archived" : "restored";
  await afterLabChange(tx, {
    labId,
    changeKey: `chart:${chartId}:${verb}:${now.getTime()}`,
    cause: `Chart "${chart.title}" was ${archive ? "archived" : "restored from the archive"} by ${actor.name}`,
  });
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: `chart.${verb}`,
    targetType: "chart",
    targetId: chartId,
    detail: archive ? { title: chart.title } : { title: chart.title, archivedAt: chart.archivedAt!.toISOString() },
  });
  return { id: chartId, title: chart.title, archivedAt };
}
