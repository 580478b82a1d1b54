import { and, count, eq, like } from "drizzle-orm";
import { db } from "@/db";
import { auditEvents } from "@/db/schema";

/** Audit events of one lab, optionally only actions starting with `prefix` (e.g. "stock."). */
export async function auditCount(labId: number, prefix?: string): Promise<number> {
  const where = prefix
    ? and(eq(auditEvents.labId, labId), like(auditEvents.action, `${prefix}%`))
    : eq(auditEvents.labId, labId);
  const [row] = await db.select({ n: count() }).from(auditEvents).where(where);
  return Number(row!.n);
}
