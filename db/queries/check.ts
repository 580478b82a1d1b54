import "server-only";
import { and, desc, eq, ne, sql } from "drizzle-orm";
import { sameClinical } from "@/lib/charts/clinical";
import type { Snapshot } from "@/lib/charts/snapshot";
import { copyAction, type CopyAction } from "@/lib/editions/action";
import { checkEdition, type CheckStatus, type Reworded } from "@/lib/editions/check";
import type { Change } from "@/lib/charts/changes";
import { db } from "../index";
import { charts, editions, labs } from "../schema";

export type CheckView = {
  status: CheckStatus;
  action: CopyAction;
  reviewBy: Date | null;
  since: Date | null;
  edition: { id: number; number: number; approvedAt: Date | null; shortCode: string };
  chart: { id: number; title: string };
  lab: {
    id: number;
    slug: string;
    name: string;
    isDemo: boolean;
    timeZone: string;
    numberFormat: "point" | "comma";
    contactLine: string | null;
  };
  changes: Change[];
  currentEdition: { id: number; number: number; approvedAt: Date | null } | null;
  /** An edition that only rewords this copy (its clinical content is the same), when one exists. */
  reworded: Reworded | null;
  /** The snapshots the check page compares cell by cell (lib/editions/check-cells.ts). */
  snapshots: { printed: Snapshot; current: Snapshot | null; live: Snapshot | null };
};

/**
 * Everything the public check page shows for one QR token: no personal data. Every column this
 * reads is also in getCheckVersion (snapshots through their fingerprints), so a page cached
 * under that version is the page this would build.
 */
export async function getCheckByToken({
  token,
  now = new Date(),
}: {
  token: string;
  now?: Date;
}): Promise<CheckView | null> {
  const [row] = await db
    .select({
      edition: editions,
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
  if (!row) return null;
  const [current] = await db
    .select({
      id: editions.id,
      number: editions.number,
      approvedAt: editions.approvedAt,
      fingerprint: editions.fingerprint,
      snapshot: editions.snapshot,
    })
    .from(editions)
    .where(and(eq(editions.chartId, row.chart.id), eq(editions.status, "approved"), ne(editions.id, row.edition.id)))
    .orderBy(desc(editions.number))
    .limit(1);
  const [draft] = await db
    .select({ number: editions.number, fingerprint: editions.fingerprint, snapshot: editions.snapshot })
    .from(editions)
    .where(and(eq(editions.chartId, row.chart.id), eq(editions.status, "draft")))
    .orderBy(desc(editions.number))
    .limit(1);
  const liveSnapshot = row.chart.liveSnapshot as Snapshot | null;
  const result = checkEdition(
    { ...row.edition, snapshot: row.edition.snapshot as Snapshot },
    { liveFingerprint: row.chart.liveFingerprint, liveSnapshot, archivedAt: row.chart.archivedAt },
    current ? { ...current, snapshot: current.snapshot as Snapshot } : null,
    draft ? { ...draft, snapshot: draft.snapshot as Snapshot } : null,
  );
  // An archived chart has nothing to replace its copies with: they come down.
  const archived = row.chart.archivedAt !== null;
  const since =
    result.status === "withdrawn"
      ? (row.edition.withdrawnAt ?? row.chart.archivedAt)
      : result.status === "superseded"
        ? row.edition.supersededAt
        : result.status === "outdated"
          ? row.chart.liveChangedAt
          : result.status === "current"
            ? row.edition.approvedAt
            : row.edition.createdAt;
  const action = copyAction({
    status: result.status,
    reviewBy: row.edition.reviewBy,
    replacement:
      current && !archived
        ? {
            number: current.number,
            // A replacement that only rewords today's chart still prints today's clinical content.
            matchesToday:
              current.fingerprint === row.chart.liveFingerprint ||
              (liveSnapshot !== null && sameClinical(current.snapshot as Snapshot, liveSnapshot)),
          }
        : null,
    now,
  });
  return {
    status: result.status,
    action,
    reviewBy: row.edition.reviewBy,
    since,
    edition: {
      id: row.edition.id,
      number: row.edition.number,
      approvedAt: row.edition.approvedAt,
      shortCode: row.edition.shortCode,
    },
    chart: { id: row.chart.id, title: row.chart.title },
    lab: row.lab,
    changes: result.changes,
    currentEdition:
      current && !archived ? { id: current.id, number: current.number, approvedAt: current.approvedAt } : null,
    reworded: result.reworded ?? null,
    snapshots: {
      printed: row.edition.snapshot as Snapshot,
      current: current && !archived ? (current.snapshot as Snapshot) : null,
      live: row.chart.liveSnapshot as Snapshot | null,
    },
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
 * (each snapshot is stood for by its SHA-256 fingerprint): the page built by getCheckByToken
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
