import "server-only";
import { and, count, countDistinct, eq, isNull } from "drizzle-orm";
import type { FirstRunStatus } from "@/lib/labs/first-run";
import { db } from "../index";
import { balloonFamilies, balloons, charts, editions, invitations, memberships } from "../schema";
import type { Tx } from "./audit";

/** The counts the first-run path is built from (lib/labs/first-run.ts). */
export async function readFirstRunStatus({ labId }: { labId: number }): Promise<FirstRunStatus> {
  const [[stock], roles, invited, [chartRow], [approved]] = await Promise.all([
    db
      .select({ sizes: count(), families: countDistinct(balloons.familyId) })
      .from(balloons)
      .where(and(eq(balloons.labId, labId), eq(balloons.inStock, true))),
    db
      .select({ role: memberships.role, n: count() })
      .from(memberships)
      .where(eq(memberships.labId, labId))
      .groupBy(memberships.role),
    db
      .select({ role: invitations.role, n: count() })
      .from(invitations)
      .where(and(eq(invitations.labId, labId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
      .groupBy(invitations.role),
    db
      .select({ n: count() })
      .from(charts)
      .where(and(eq(charts.labId, labId), isNull(charts.archivedAt))),
    db
      .select({ n: count() })
      .from(editions)
      .where(and(eq(editions.labId, labId), eq(editions.status, "approved"))),
  ]);
  const byRole = (rows: { role: string; n: number }[], role: string) =>
    Number(rows.find((r) => r.role === role)?.n ?? 0);
  return {
    familiesWithStock: Number(stock?.families ?? 0),
    sizesInStock: Number(stock?.sizes ?? 0),
    members: { lead: byRole(roles, "lead"), educator: byRole(roles, "educator") },
    invited: { lead: byRole(invited, "lead"), educator: byRole(invited, "educator") },
    charts: Number(chartRow?.n ?? 0),
    approvedEditions: Number(approved?.n ?? 0),
  };
}

export async function balloonFamilyExists(tx: Tx, { labId, name }: { labId: number; name: string }) {
  const [row] = await tx
    .select({ id: balloonFamilies.id })
    .from(balloonFamilies)
    .where(and(eq(balloonFamilies.labId, labId), eq(balloonFamilies.name, name)));
  return Boolean(row);
}
