import "server-only";
import { and, asc, desc, eq, inArray, isNull } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { db } from "../index";
import { charts, editions, labs, memberships } from "../schema";

/** A chart's newest approved edition, frozen snapshot included, and today's live fingerprint; null when the chart is not in the lab. */
export async function getWallEdition({ labId, chartId }: { labId: number; chartId: number }) {
  const [chart] = await db
    .select({
      id: charts.id,
      title: charts.title,
      liveFingerprint: charts.liveFingerprint,
      timeZone: labs.timeZone,
      contactLine: labs.contactLine,
    })
    .from(charts)
    .innerJoin(labs, eq(labs.id, charts.labId))
    .where(and(eq(charts.labId, labId), eq(charts.id, chartId)));
  if (!chart) return null;
  const [edition] = await db
    .select({
      id: editions.id,
      number: editions.number,
      fingerprint: editions.fingerprint,
      snapshot: editions.snapshot,
      approvedAt: editions.approvedAt,
      reviewBy: editions.reviewBy,
      shortCode: editions.shortCode,
    })
    .from(editions)
    .where(and(eq(editions.labId, labId), eq(editions.chartId, chartId), eq(editions.status, "approved")))
    .orderBy(desc(editions.number))
    .limit(1);
  return {
    chart,
    edition: edition ? { ...edition, snapshot: edition.snapshot as Snapshot } : null,
  };
}

/** The labs' charts (not archived) with their approved edition, for the calculator; newest edition first per chart. */
export async function listApprovedCharts({ labIds }: { labIds: number[] }) {
  if (labIds.length === 0) return [];
  return db
    .select({
      id: charts.id,
      labId: charts.labId,
      title: charts.title,
      liveFingerprint: charts.liveFingerprint,
      liveSnapshot: charts.liveSnapshot,
      edition: {
        number: editions.number,
        approvedAt: editions.approvedAt,
        fingerprint: editions.fingerprint,
        snapshot: editions.snapshot,
      },
    })
    .from(charts)
    .innerJoin(editions, and(eq(editions.chartId, charts.id), eq(editions.status, "approved")))
    .where(and(inArray(charts.labId, labIds), isNull(charts.archivedAt)))
    .orderBy(asc(charts.title), desc(editions.number));
}

/** The labs a person belongs to, for the calculator's lab picker. */
export async function listLabsForCalculator({ userId }: { userId: number }) {
  return db
    .select({ id: labs.id, slug: labs.slug, name: labs.name, isDemo: labs.isDemo })
    .from(memberships)
    .innerJoin(labs, eq(labs.id, memberships.labId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(labs.name));
}
