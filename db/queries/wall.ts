import "server-only";
import { and, desc, eq } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { db } from "../index";
import { charts, editions, labs } from "../schema";

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
