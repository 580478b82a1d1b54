import "server-only";
import { and, desc, eq, ne, sql } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import type { CheckRows } from "@/lib/editions/verdict";
import { db } from "../index";
import { charts, editions, labs } from "../schema";

export type { CheckRows };

const editionRow = (token: string) =>
  db
    .select({
      edition: {
        id: editions.id,
        chartId: editions.chartId,
        number: editions.number,
        status: editions.status,
        fingerprint: editions.fingerprint,
        snapshot: editions.snapshot,
        shortCode: editions.shortCode,
        createdAt: editions.createdAt,
        approvedAt: editions.approvedAt,
        supersededAt: editions.supersededAt,
        withdrawnAt: editions.withdrawnAt,
        reviewBy: editions.reviewBy,
      },
      chart: {
        id: charts.id,
        title: charts.title,
        liveFingerprint: charts.liveFingerprint,
        liveSnapshot: charts.liveSnapshot,
        liveChangedAt: charts.liveChangedAt,
        archivedAt: charts.archivedAt,
      },
      lab: {
        id: labs.id,
        slug: labs.slug,
        name: labs.name,
        isDemo: labs.isDemo,
        timeZone: labs.timeZone,
        numberFormat: labs.numberFormat,
        contactLine: labs.contactLine,
      },
    })
    .from(editions)
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .innerJoin(labs, eq(labs.id, editions.labId))
    .where(eq(editions.checkToken, token));

/** The chart's newest approved edition other than `editionId`. */
const otherApproved = (chartId: number, editionId: number) =>
  db
    .select({
      id: editions.id,
      number: editions.number,
      approvedAt: editions.approvedAt,
      fingerprint: editions.fingerprint,
      snapshot: editions.snapshot,
    })
    .from(editions)
    .where(and(eq(editions.chartId, chartId), eq(editions.status, "approved"), ne(editions.id, editionId)))
    .orderBy(desc(editions.number))
    .limit(1);

const newestDraft = (chartId: number) =>
  db
    .select({ number: editions.number, fingerprint: editions.fingerprint, snapshot: editions.snapshot })
    .from(editions)
    .where(and(eq(editions.chartId, chartId), eq(editions.status, "draft")))
    .orderBy(desc(editions.number))
    .limit(1);

/**
 * The rows the public check of one QR token reads (lib/editions/verdict.ts decides from them);
 * no personal data. Every column this reads is also in getCheckVersion (snapshots through their
 * fingerprints), so a page cached under that version is the page these rows would build.
 */
export async function readCheckRows({ token }: { token: string }): Promise<CheckRows | null> {
  const [row] = await editionRow(token);
  if (!row) return null;
  const [[current], [draft]] = await Promise.all([
    otherApproved(row.chart.id, row.edition.id),
    newestDraft(row.chart.id),
  ]);
  const snap = (s: unknown) => s as Snapshot;
  return {
    edition: { ...row.edition, snapshot: snap(row.edition.snapshot) },
    chart: { ...row.chart, liveSnapshot: row.chart.liveSnapshot as Snapshot | null },
    lab: row.lab,
    current: current ? { ...current, snapshot: snap(current.snapshot) } : null,
    draft: draft ? { ...draft, snapshot: snap(draft.snapshot) } : null,
  };
}

/** The check token of the edition with this short code (already parsed by parseShortCode), or null. */
export async function getCheckTokenByShortCode({ code }: { code: string }): Promise<string | null> {
  const [row] = await db
    .select({ token: editions.checkToken })
    .from(editions)
    .where(eq(editions.shortCode, code))
    .limit(1);
  return row?.token ?? null;
}

/**
 * What the check page for this token depends on, in one indexed query without the snapshots
 * (each snapshot is stood for by its SHA-256 fingerprint): the page built from readCheckRows
 * is the same for as long as this string is, except for the review-by date passing
 * (lib/http/check-page.ts keys on that too). Null for an unknown token.
 */
export async function getCheckVersion({
  token,
}: {
  token: string;
}): Promise<{ version: string; reviewBy: Date | null } | null> {
  const [row] = await db
    .select({
      edition: sql<string>`json_array(${editions.id}, ${editions.status}, ${editions.fingerprint}, ${editions.number},
        ${editions.shortCode}, ${editions.createdAt}, ${editions.approvedAt}, ${editions.approvedByName},
        ${editions.rejectedAt}, ${editions.supersededAt}, ${editions.withdrawnAt}, ${editions.reviewBy})`,
      chart: sql<string>`json_array(${charts.id}, ${charts.title}, ${charts.liveFingerprint}, ${charts.liveChangedAt},
        ${charts.archivedAt})`,
      lab: sql<string>`json_array(${labs.id}, ${labs.slug}, ${labs.name}, ${labs.isDemo}, ${labs.timeZone},
        ${labs.numberFormat}, ${labs.contactLine})`,
      current: sql<string | null>`(select json_array(o.id, o.number, o.fingerprint, o.approved_at) from ${editions} o
        where o.chart_id = ${editions.chartId} and o.status = 'approved' and o.id <> ${editions.id}
        order by o.number desc limit 1)`,
      draft: sql<string | null>`(select json_array(d.number, d.fingerprint) from ${editions} d
        where d.chart_id = ${editions.chartId} and d.status = 'draft' order by d.number desc limit 1)`,
      reviewBy: editions.reviewBy,
    })
    .from(editions)
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .innerJoin(labs, eq(labs.id, editions.labId))
    .where(eq(editions.checkToken, token));
  if (!row) return null;
  return {
    version: JSON.stringify([row.edition, row.chart, row.lab, row.current, row.draft]),
    reviewBy: row.reviewBy,
  };
}
