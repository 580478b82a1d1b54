import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { RulesChange } from "@/lib/editions/prints";
import { db } from "../index";
import { auditEvents, labTokens, users } from "../schema";
import { actorNameSql } from "./audit";

/** The lab's rules changes from the audit log, oldest first, with who made each. */
export async function listRulesChanges({ labId }: { labId: number }): Promise<RulesChange[]> {
  const rows = await db
    .select({ actorName: actorNameSql, detail: auditEvents.detail })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .leftJoin(labTokens, eq(labTokens.id, auditEvents.actorTokenId))
    .where(and(eq(auditEvents.labId, labId), eq(auditEvents.action, "lab.rules_updated")))
    .orderBy(asc(auditEvents.id));
  return rows.map((r) => {
    const d = (r.detail ?? {}) as { before?: unknown; after?: unknown };
    return { actorName: r.actorName, before: d.before, after: d.after };
  });
}
