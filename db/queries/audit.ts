import "server-only";
import { and, asc, desc, eq, gt, gte, inArray, isNull, like, lt, or, sql, type SQL } from "drizzle-orm";
import type { Database } from "../index";
import { db as defaultDb } from "../index";
import { AUDIT_KINDS, type AuditKind } from "@/lib/audit/describe";
import { DEFAULT_TIME_ZONE, nextDay, zonedDayStart } from "@/lib/format/dates";
import { auditEvents, charts, editions, labs, labTokens, postings, rooms, users } from "../schema";

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

/** The one shape of "who did it" that writes receive. */
export type Actor = { id: number; name: string };

export type AuditInput = {
  labId: number | null;
  actorUserId: number | null;
  /** The machine token that made the change, instead of a person (shown as "token <name>"). */
  actorTokenId?: number | null;
  action: string;
  targetType?: string;
  targetId?: string | number;
  detail?: Record<string, unknown>;
};

/** The actor as people read it: the person's name, or "token <name>" for a lab's machine token. */
export const actorNameSql = sql<string | null>`COALESCE(${users.name}, CONCAT('token ', ${labTokens.name}))`;

/** Records who did what; pass the transaction so the record lands with the change itself. */
export async function recordAudit({ tx, ...event }: AuditInput & { tx?: Tx | Database }): Promise<void> {
  await (tx ?? defaultDb).insert(auditEvents).values({
    labId: event.labId,
    actorUserId: event.actorUserId,
    actorTokenId: event.actorTokenId ?? null,
    action: event.action,
    targetType: event.targetType ?? null,
    targetId: event.targetId === undefined ? null : String(event.targetId),
    detail: event.detail ?? null,
  });
}

/**
 * A lab's audit log, newest first: only events stored with this lab (a member's account events,
 * stored with no lab, belong to their own account page). Keyset pages: `before` for older,
 * `after` for newer.
 */
export async function listAuditEvents({
  labId,
  before,
  after,
  limit = 50,
  kind,
  actor,
  from,
  to,
}: {
  labId: number;
  before?: number;
  after?: number;
  limit?: number;
} & AuditFilters) {
  const inLab = and(
    eq(auditEvents.labId, labId),
    filterWhere({ kind, actor, from, to }, from || to ? await labTimeZone(labId) : undefined),
  );
  const size = Math.min(Math.max(limit, 1), 200);
  const rows = await defaultDb
    .select({
      id: auditEvents.id,
      labId: auditEvents.labId,
      action: auditEvents.action,
      targetType: auditEvents.targetType,
      targetId: auditEvents.targetId,
      detail: auditEvents.detail,
      createdAt: auditEvents.createdAt,
      actorName: actorNameSql,
      actorEmail: users.email,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .leftJoin(labTokens, eq(labTokens.id, auditEvents.actorTokenId))
    .where(and(inLab, before ? lt(auditEvents.id, before) : undefined, after ? gt(auditEvents.id, after) : undefined))
    .orderBy(after && !before ? asc(auditEvents.id) : desc(auditEvents.id))
    .limit(size + 1);
  const more = rows.length > size;
  const page = rows.slice(0, size);
  if (after && !before) page.reverse();
  const newest = page[0]?.id;
  const oldest = page.at(-1)?.id;
  const hasOlder =
    after && !before ? oldest !== undefined && (await hasEvent(and(inLab, lt(auditEvents.id, oldest)))) : more;
  const hasNewer =
    after && !before
      ? more
      : newest !== undefined &&
        (before !== undefined || after !== undefined) &&
        (await hasEvent(and(inLab, gt(auditEvents.id, newest))));
  const { rows: events, chartTitles } = await withSubjects(labId, page);
  return {
    events,
    chartTitles,
    olderBefore: hasOlder ? oldest : undefined,
    newerAfter: hasNewer ? newest : undefined,
  };
}

/**
 * One person's own account events (sign-ins, sign-outs, passwords, e-mail changes), newest
 * first: stored with no lab, done by them or about their account.
 */
export async function listAccountEvents({ userId, limit = 20 }: { userId: number; limit?: number }) {
  return defaultDb
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      detail: auditEvents.detail,
      createdAt: auditEvents.createdAt,
    })
    .from(auditEvents)
    .where(
      and(
        isNull(auditEvents.labId),
        or(
          eq(auditEvents.actorUserId, userId),
          and(eq(auditEvents.targetType, "user"), eq(auditEvents.targetId, String(userId))),
        ),
      ),
    )
    .orderBy(desc(auditEvents.id))
    .limit(Math.min(Math.max(limit, 1), 100));
}

/** Which events to show: one kind of event, one person's, between two calendar dates (the lab's, inclusive). */
export type AuditFilters = { kind?: AuditKind; actor?: number; from?: string; to?: string };

async function labTimeZone(labId: number): Promise<string> {
  const [lab] = await defaultDb.select({ timeZone: labs.timeZone }).from(labs).where(eq(labs.id, labId));
  return lab?.timeZone ?? DEFAULT_TIME_ZONE;
}

/** `from` and `to` are calendar days in `timeZone` (the lab's): from the first day's start to the last day's end. */
function filterWhere({ kind, actor, from, to }: AuditFilters, timeZone = DEFAULT_TIME_ZONE): SQL | undefined {
  const parts: (SQL | undefined)[] = [];
  if (kind)
    parts.push(
      or(
        ...AUDIT_KINDS[kind].actions.map((a) =>
          a.endsWith(".") ? like(auditEvents.action, `${a.replace(/_/g, "\\_")}%`) : eq(auditEvents.action, a),
        ),
      ),
    );
  if (actor) parts.push(eq(auditEvents.actorUserId, actor));
  if (from) parts.push(gte(auditEvents.createdAt, zonedDayStart(from, timeZone)));
  if (to) parts.push(lt(auditEvents.createdAt, zonedDayStart(nextDay(to), timeZone)));
  return parts.length ? and(...parts) : undefined;
}

/**
 * Names what each event is about, so every row can say it: the chart (by title), the edition
 * (chart title, number and short code) and the room, looked up for the page's rows at once.
 */
async function withSubjects<
  E extends { action: string; targetType: string | null; targetId: string | null; detail: unknown },
>(labId: number, events: E[]) {
  const num = (v: unknown) => (typeof v === "number" || (typeof v === "string" && /^\d+$/.test(v)) ? Number(v) : null);
  const detailOf = (e: E) => (e.detail && typeof e.detail === "object" ? (e.detail as Record<string, unknown>) : {});
  const postingIds = events.filter((e) => e.targetType === "posting").map((e) => num(e.targetId)!);
  const postingRows = postingIds.length
    ? await defaultDb
        .select({ id: postings.id, editionId: postings.editionId, roomId: postings.roomId })
        .from(postings)
        .where(and(eq(postings.labId, labId), inArray(postings.id, postingIds)))
    : [];
  const editionIdOf = (e: E) =>
    e.targetType === "edition"
      ? num(e.targetId)
      : e.targetType === "posting"
        ? (postingRows.find((p) => p.id === num(e.targetId))?.editionId ?? null)
        : null;
  const editionIds = [...new Set(events.map(editionIdOf).filter((x): x is number => x !== null))];
  const editionRows = editionIds.length
    ? await defaultDb
        .select({ id: editions.id, chartId: editions.chartId, number: editions.number, shortCode: editions.shortCode })
        .from(editions)
        .where(and(eq(editions.labId, labId), inArray(editions.id, editionIds)))
    : [];
  const chartIdOf = (e: E) =>
    e.targetType === "chart"
      ? num(e.targetId)
      : (editionRows.find((x) => x.id === editionIdOf(e))?.chartId ?? num(detailOf(e).chartId));
  const ruleChartIds = events.flatMap((e) =>
    e.action === "lab.rules_updated"
      ? ["before", "after"].flatMap((side) => {
          const ex = (detailOf(e)[side] as { exceptions?: { chartId?: unknown }[] } | undefined)?.exceptions;
          return Array.isArray(ex) ? ex.map((x) => num(x.chartId)) : [];
        })
      : [],
  );
  const chartIds = [...new Set([...events.map(chartIdOf), ...ruleChartIds].filter((x): x is number => x !== null))];
  const chartRows = chartIds.length
    ? await defaultDb
        .select({ id: charts.id, title: charts.title })
        .from(charts)
        .where(and(eq(charts.labId, labId), inArray(charts.id, chartIds)))
    : [];
  const roomIdOf = (e: E) =>
    e.targetType === "room"
      ? num(e.targetId)
      : e.targetType === "posting"
        ? (postingRows.find((p) => p.id === num(e.targetId))?.roomId ?? null)
        : null;
  const roomIds = [...new Set(events.map(roomIdOf).filter((x): x is number => x !== null))];
  const roomRows = roomIds.length
    ? await defaultDb
        .select({ id: rooms.id, name: rooms.name })
        .from(rooms)
        .where(and(eq(rooms.labId, labId), inArray(rooms.id, roomIds)))
    : [];
  return {
    rows: events.map((e) => {
      const ed = editionRows.find((x) => x.id === editionIdOf(e));
      const chart = chartRows.find((c) => c.id === chartIdOf(e));
      return {
        ...e,
        chart: chart ? { id: chart.id, title: chart.title } : null,
        edition: ed ? { id: ed.id, number: ed.number, shortCode: ed.shortCode } : null,
        room: roomRows.find((r) => r.id === roomIdOf(e))?.name ?? null,
      };
    }),
    chartTitles: Object.fromEntries(chartRows.map((c) => [c.id, c.title])) as Record<number, string>,
  };
}

async function hasEvent(where: SQL | undefined): Promise<boolean> {
  const [row] = await defaultDb.select({ id: auditEvents.id }).from(auditEvents).where(where).limit(1);
  return Boolean(row);
}

export type AuditPage = Awaited<ReturnType<typeof listAuditEvents>>;
export type AuditEntry = AuditPage["events"][number];

export type { Tx };
