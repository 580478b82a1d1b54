import "server-only";
import { and, desc, eq, lt } from "drizzle-orm";
import type { Database } from "../index";
import { db as defaultDb } from "../index";
import { auditEvents, users } from "../schema";

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

export type AuditInput = {
  labId: number | null;
  actorUserId: number | null;
  action: string;
  targetType?: string;
  targetId?: string | number;
  detail?: Record<string, unknown>;
};

/** Records who did what; pass the transaction so the record lands with the change itself. */
export async function recordAudit({ tx, ...event }: AuditInput & { tx?: Tx | Database }): Promise<void> {
  await (tx ?? defaultDb).insert(auditEvents).values({
    labId: event.labId,
    actorUserId: event.actorUserId,
    action: event.action,
    targetType: event.targetType ?? null,
    targetId: event.targetId === undefined ? null : String(event.targetId),
    detail: event.detail ?? null,
  });
}

export async function listAuditEvents({ labId, before, limit = 50 }: { labId: number; before?: number; limit?: number }) {
  return defaultDb
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      targetType: auditEvents.targetType,
      targetId: auditEvents.targetId,
      detail: auditEvents.detail,
      createdAt: auditEvents.createdAt,
      actorName: users.name,
      actorEmail: users.email,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(before ? and(eq(auditEvents.labId, labId), lt(auditEvents.id, before)) : eq(auditEvents.labId, labId))
    .orderBy(desc(auditEvents.id))
    .limit(Math.min(Math.max(limit, 1), 200));
}

export type { Tx };
