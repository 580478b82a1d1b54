import "server-only";
import { randomBytes } from "node:crypto";
import { and, asc, desc, eq, isNull, max, ne } from "drizzle-orm";
import { describeChanges } from "@/lib/charts/changes";
import { fingerprintOf } from "@/lib/charts/fingerprint";
import { assertChartRules } from "@/lib/charts/rules";
import { buildSnapshot, snapshotProblems, type Snapshot } from "@/lib/charts/snapshot";
import { newShortCode } from "@/lib/editions/short-code";
import { canTransition, type EditionStatus } from "@/lib/editions/states";
import { checkChartAgainstRules, ruledDefinition, ruledSnapshot, reviewByDate } from "@/lib/labs/rules";
import { parseStoredDefinition } from "@/lib/validation/chart";
import { AppError, notFound } from "@/lib/errors";
import { db } from "../index";
import { charts, editions, logos, users } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";
import { afterLabChange, refreshLiveSnapshots } from "./lab-changes";
import { getLabRules } from "./lab-rules";
import { lockLab } from "./lab-lock";
import { readStock } from "./stock-read";

/** 144 random bits, URL-safe: the edition's check-page token. */
const newCheckToken = () => randomBytes(18).toString("base64url");

export async function findEditionLab({ editionId }: { editionId: number }) {
  const [row] = await db.select({ labId: editions.labId }).from(editions).where(eq(editions.id, editionId));
  return row?.labId ?? null;
}

export async function getEdition({ labId, editionId }: { labId: number; editionId: number }) {
  const [row] = await db
    .select({ edition: editions, chartTitle: charts.title, createdByName: users.name })
    .from(editions)
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(and(eq(editions.id, editionId), eq(editions.labId, labId)));
  if (!row) return null;
  return {
    ...row.edition,
    snapshot: row.edition.snapshot as Snapshot,
    chartTitle: row.chartTitle,
    createdByName: row.createdByName,
  };
}

const againstColumns = {
  id: editions.id,
  number: editions.number,
  status: editions.status,
  snapshot: editions.snapshot,
  approvedAt: editions.approvedAt,
  approvedByName: editions.approvedByName,
};

/**
 * What an edition is compared with: the edition it replaced when it was approved (kept with the
 * approval), or, for one never approved, the chart's approved edition it would replace now.
 */
export async function getAgainstEdition({
  labId,
  edition,
}: {
  labId: number;
  edition: { id: number; chartId: number; approvedAt: Date | null; replacesId: number | null };
}) {
  if (edition.replacesId !== null) {
    const [row] = await db
      .select(againstColumns)
      .from(editions)
      .where(and(eq(editions.labId, labId), eq(editions.id, edition.replacesId)));
    return row ? { ...row, snapshot: row.snapshot as Snapshot } : null;
  }
  if (edition.approvedAt) return null;
  return getReplacedEdition({ labId, chartId: edition.chartId, editionId: edition.id });
}

/** The chart's approved edition other than this one: what approving this edition would replace. */
export async function getReplacedEdition({
  labId,
  chartId,
  editionId,
}: {
  labId: number;
  chartId: number;
  editionId: number;
}) {
  const [row] = await db
    .select(againstColumns)
    .from(editions)
    .where(
      and(
        eq(editions.labId, labId),
        eq(editions.chartId, chartId),
        eq(editions.status, "approved"),
        ne(editions.id, editionId),
      ),
    )
    .orderBy(desc(editions.number))
    .limit(1);
  return row ? { ...row, snapshot: row.snapshot as Snapshot } : null;
}

/** Drafts waiting for sign-off in a lab, oldest first; archived charts' drafts do not wait. */
export async function listWaitingDrafts({ labId }: { labId: number }) {
  return db
    .select({
      id: editions.id,
      number: editions.number,
      chartId: editions.chartId,
      chartTitle: charts.title,
      createdAt: editions.createdAt,
      createdBy: editions.createdBy,
      createdByName: users.name,
    })
    .from(editions)
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(and(eq(editions.labId, labId), eq(editions.status, "draft"), isNull(charts.archivedAt)))
    .orderBy(asc(editions.createdAt), asc(editions.id));
}

export async function listEditions({ labId, chartId }: { labId: number; chartId: number }) {
  return db
    .select({
      id: editions.id,
      number: editions.number,
      status: editions.status,
      fingerprint: editions.fingerprint,
      checkToken: editions.checkToken,
      createdAt: editions.createdAt,
      createdBy: editions.createdBy,
      createdByName: users.name,
      approvedAt: editions.approvedAt,
      approvedByName: editions.approvedByName,
      reviewBy: editions.reviewBy,
      rejectedAt: editions.rejectedAt,
      rejectionReason: editions.rejectionReason,
      withdrawnAt: editions.withdrawnAt,
    })
    .from(editions)
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(and(eq(editions.labId, labId), eq(editions.chartId, chartId)))
    .orderBy(desc(editions.number));
}

/** A chart's editions, newest first, with what their history needs: snapshot, people, predecessor. */
export async function listEditionHistory({ labId, chartId }: { labId: number; chartId: number }) {
  const rows = await db
    .select({
      id: editions.id,
      number: editions.number,
      status: editions.status,
      snapshot: editions.snapshot,
      createdAt: editions.createdAt,
      createdByName: users.name,
      approvedAt: editions.approvedAt,
      approvedByName: editions.approvedByName,
      replacesId: editions.replacesId,
    })
    .from(editions)
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(and(eq(editions.labId, labId), eq(editions.chartId, chartId)))
    .orderBy(desc(editions.number));
  return rows.map((r) => ({ ...r, snapshot: r.snapshot as Snapshot }));
}

/** Freezes what the chart prints today into a new numbered draft. */
export async function createEdition(
  tx: Tx,
  { labId, chartId, actor }: { labId: number; chartId: number; actor: Actor },
) {
  const lab = await lockLab(tx, labId);
  const [chart] = await tx
    .select({
      id: charts.id,
      title: charts.title,
      definition: charts.definition,
      logoSha256: logos.sha256,
      archivedAt: charts.archivedAt,
    })
    .from(charts)
    .leftJoin(logos, eq(logos.id, charts.logoId))
    .where(and(eq(charts.id, chartId), eq(charts.labId, labId)));
  if (!chart) throw notFound("Chart");
  if (chart.archivedAt) throw new AppError("conflict", `"${chart.title}" is archived: it cannot get new editions.`);
  const definition = parseStoredDefinition(chart.definition);
  const stock = await readStock(tx, labId);
  assertChartRules(definition, stock);
  const rules = await getLabRules({ labId }, tx);
  const snapshot = buildSnapshot({
    labName: lab.name,
    labIsDemo: lab.isDemo,
    definition,
    stock,
    logoSha256: chart.logoSha256 ?? null,
    ruleExceptions: checkChartAgainstRules(chartId, ruledDefinition(definition), rules).applied,
    labLimits: rules.lookups,
  });
  const problems = snapshotProblems(snapshot, definition);
  if (problems.length) throw new AppError("unprocessable", problems.join(" "));
  const fingerprint = fingerprintOf(snapshot);
  // Pressing "Create edition" twice gives the one draft, not two identical ones.
  const [same] = await tx
    .select({ id: editions.id, number: editions.number, checkToken: editions.checkToken })
    .from(editions)
    .where(
      and(
        eq(editions.chartId, chartId),
        eq(editions.labId, labId),
        eq(editions.status, "draft"),
        eq(editions.fingerprint, fingerprint),
      ),
    )
    .orderBy(desc(editions.number))
    .limit(1);
  if (same) return { ...same, fingerprint, reused: true };
  const [last] = await tx
    .select({ n: max(editions.number) })
    .from(editions)
    .where(eq(editions.chartId, chartId));
  const number = (last?.n ?? 0) + 1;
  const checkToken = newCheckToken();
  const shortCode = newShortCode();
  const [row] = await tx
    .insert(editions)
    .values({
      labId,
      chartId,
      number,
      status: "draft",
      snapshot,
      fingerprint,
      checkToken,
      shortCode,
      createdBy: actor.id,
    })
    .$returningId();
  await refreshLiveSnapshots(tx, labId);
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "edition.created",
    targetType: "edition",
    targetId: row!.id,
    detail: { chartId, number, fingerprint },
  });
  return { id: row!.id, number, fingerprint, checkToken, reused: false };
}

/** The one guarded path for every edition state change; the database triggers agree with it. */
async function transition(tx: Tx, { labId, editionId, to }: { labId: number; editionId: number; to: EditionStatus }) {
  const [ed] = await tx
    .select()
    .from(editions)
    .where(and(eq(editions.id, editionId), eq(editions.labId, labId)))
    .for("update");
  if (!ed) throw notFound("Edition");
  if (!canTransition(ed.status, to)) {
    const state = ed.status === "returned" ? "sent back" : ed.status;
    const verb = to === "returned" ? "sent back" : `made ${to}`;
    throw new AppError("conflict", `Edition ${ed.number} is ${state}; it cannot be ${verb}.`);
  }
  return ed;
}

export async function approveEdition(
  tx: Tx,
  { labId, editionId, actor }: { labId: number; editionId: number; actor: Actor },
) {
  const ed = await transition(tx, { labId, editionId, to: "approved" });
  const [chart] = await tx
    .select({
      title: charts.title,
      liveFingerprint: charts.liveFingerprint,
      liveSnapshot: charts.liveSnapshot,
      archivedAt: charts.archivedAt,
    })
    .from(charts)
    .where(eq(charts.id, ed.chartId));
  if (chart?.archivedAt) throw new AppError("conflict", `"${chart.title}" is archived: its drafts cannot be approved.`);
  if (chart?.liveFingerprint && chart.liveFingerprint !== ed.fingerprint) {
    const changes = describeChanges(ed.snapshot as Snapshot, chart.liveSnapshot as Snapshot).map((c) => c.detail);
    throw new AppError(
      "conflict",
      `This draft no longer matches the lab's stock and settings${changes.length ? ` (${changes.slice(0, 3).join("; ")})` : ""}. Create a new edition and approve that.`,
    );
  }
  // A chart outside the lab's rules (and not excepted by the medical lead) is never approved.
  const rules = await getLabRules({ labId }, tx);
  const snap = ed.snapshot as Snapshot;
  const { issues } = checkChartAgainstRules(ed.chartId, ruledSnapshot(snap), rules);
  if (issues.length)
    throw new AppError(
      "unprocessable",
      `This chart is outside the lab's rules, so it cannot be approved. ${issues[0]!.message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ""}. Change the chart, or the medical lead records an exception on the rules page.`,
      issues.map((i) => ({ path: i.path, message: i.message })),
    );
  const now = new Date();
  // The review-by date follows the lab's review period at the time of approval and never moves.
  const { reviewPeriodMonths } = rules;
  const reviewBy = reviewByDate(now, reviewPeriodMonths);
  const previous = await tx
    .select({ id: editions.id, number: editions.number })
    .from(editions)
    .where(and(eq(editions.chartId, ed.chartId), eq(editions.status, "approved"), ne(editions.id, ed.id)));
  for (const p of previous) {
    await tx
      .update(editions)
      .set({ status: "superseded", supersededAt: now })
      .where(and(eq(editions.id, p.id), eq(editions.labId, labId)));
  }
  await tx
    .update(editions)
    .set({
      status: "approved",
      approvedBy: actor.id,
      approvedByName: actor.name,
      approvedAt: now,
      reviewBy,
      replacesId: previous.reduce<{ id: number; number: number } | null>(
        (a, p) => (a && a.number > p.number ? a : p),
        null,
      )?.id,
    })
    .where(and(eq(editions.id, ed.id), eq(editions.labId, labId)));
  await afterLabChange(tx, {
    labId,
    changeKey: `edition:${ed.id}:approved`,
    cause: `Edition ${ed.number} of "${chart?.title}" was approved by ${actor.name}`,
  });
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "edition.approved",
    targetType: "edition",
    targetId: ed.id,
    detail: {
      chartId: ed.chartId,
      number: ed.number,
      fingerprint: ed.fingerprint,
      superseded: previous.map((p) => p.number),
      reviewBy: reviewBy.toISOString(),
    },
  });
  return { id: ed.id, number: ed.number, superseded: previous, reviewBy };
}

/** Who moves which edition, and why (sending back and withdrawing both need a reason). */
type ReasonedChange = { labId: number; editionId: number; actor: Actor; reason: string };

export async function rejectEdition(tx: Tx, { labId, editionId, actor, reason }: ReasonedChange) {
  const ed = await transition(tx, { labId, editionId, to: "returned" });
  await tx
    .update(editions)
    .set({ status: "returned", rejectedBy: actor.id, rejectedAt: new Date(), rejectionReason: reason })
    .where(and(eq(editions.id, ed.id), eq(editions.labId, labId)));
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "edition.rejected",
    targetType: "edition",
    targetId: ed.id,
    detail: { number: ed.number, reason },
  });
  return { id: ed.id, number: ed.number };
}

export async function withdrawEdition(tx: Tx, { labId, editionId, actor, reason }: ReasonedChange) {
  const ed = await transition(tx, { labId, editionId, to: "withdrawn" });
  await tx
    .update(editions)
    .set({ status: "withdrawn", withdrawnBy: actor.id, withdrawnAt: new Date(), withdrawalReason: reason })
    .where(and(eq(editions.id, ed.id), eq(editions.labId, labId)));
  await afterLabChange(tx, {
    labId,
    changeKey: `edition:${ed.id}:withdrawn`,
    cause: `Edition ${ed.number} of a chart was withdrawn: ${reason}`,
  });
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "edition.withdrawn",
    targetType: "edition",
    targetId: ed.id,
    detail: { number: ed.number, was: ed.status, reason },
  });
  return { id: ed.id, number: ed.number, was: ed.status };
}
