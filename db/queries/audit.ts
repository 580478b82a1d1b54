import "server-only";
import { and, asc, desc, eq, gt, inArray, isNull, lt, or, sql, type SQL } from "drizzle-orm";
import type { Database } from "../index";
import { db as defaultDb } from "../index";
import { auditEvents, labTokens, memberships, users } from "../schema";

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
 * A lab's audit log, newest first: the lab's own events plus account events (sign-ins, password
 * resets) of people who are members of the lab now. Keyset pages: `before` for older, `after`
 * for newer.
 */
export async function listAuditEvents({
  labId,
  before,
  after,
  limit = 50,
}: {
  labId: number;
  before?: number;
  after?: number;
  limit?: number;
}) {
  const members = defaultDb
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(eq(memberships.labId, labId));
  const memberIds = defaultDb
    .select({ id: sql<string>`CAST(${memberships.userId} AS CHAR)` })
    .from(memberships)
    .where(eq(memberships.labId, labId));
  const inLab = or(
    eq(auditEvents.labId, labId),
    and(
      isNull(auditEvents.labId),
      or(
        inArray(auditEvents.actorUserId, members),
        and(eq(auditEvents.targetType, "user"), inArray(auditEvents.targetId, memberIds)),
      ),
    ),
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
  return { events: page, olderBefore: hasOlder ? oldest : undefined, newerAfter: hasNewer ? newest : undefined };
}

async function hasEvent(where: SQL | undefined): Promise<boolean> {
  const [row] = await defaultDb.select({ id: auditEvents.id }).from(auditEvents).where(where).limit(1);
  return Boolean(row);
}

export type AuditPage = Awaited<ReturnType<typeof listAuditEvents>>;
export type AuditEntry = AuditPage["events"][number];

export type { Tx };
