import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkEdition, type CheckStatus } from "@/lib/editions/check";
import type { Database } from "../index";
import { charts, editions, postings, rooms, users } from "../schema";
import type { Tx } from "./audit";

export type PostingView = {
  postingId: number;
  roomId: number;
  room: string;
  postedAt: Date;
  postedByName: string | null;
  /** The status the lab pass last stored for this copy. */
  lastStatus: CheckStatus;
  edition: { id: number; number: number };
  chart: { id: number; title: string };
  status: CheckStatus;
  changes: string[];
  /** The chart's approved edition when it is not this copy's own: the one to print instead. */
  current: { id: number; number: number } | null;
};

/**
 * Every printed copy hanging in the lab with its status today, worked out from what the lab pass
 * stored (the charts' live fingerprints): two queries for the whole lab, none per copy.
 */
export async function readPostings(conn: Tx | Database, labId: number): Promise<PostingView[]> {
  const rows = await conn
    .select({
      posting: postings,
      room: rooms.name,
      postedByName: users.name,
      edition: editions,
      chart: {
        id: charts.id,
        title: charts.title,
        liveFingerprint: charts.liveFingerprint,
        liveSnapshot: charts.liveSnapshot,
        archivedAt: charts.archivedAt,
      },
    })
    .from(postings)
    .innerJoin(rooms, eq(rooms.id, postings.roomId))
    .innerJoin(editions, eq(editions.id, postings.editionId))
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .leftJoin(users, eq(users.id, postings.postedBy))
    .where(and(eq(postings.labId, labId), isNull(postings.removedAt)))
    .orderBy(desc(postings.postedAt));
  if (rows.length === 0) return [];
  const approved = await conn
    .select({
      id: editions.id,
      chartId: editions.chartId,
      number: editions.number,
      approvedAt: editions.approvedAt,
      snapshot: editions.snapshot,
    })
    .from(editions)
    .where(and(eq(editions.labId, labId), eq(editions.status, "approved")));
  return rows.map((r) => {
    // An archived chart's copies have nothing to be replaced with.
    const current = r.chart.archivedAt
      ? null
      : (approved.find((a) => a.chartId === r.chart.id && a.id !== r.edition.id) ?? null);
    const result = checkEdition(
      { ...r.edition, snapshot: r.edition.snapshot as Snapshot },
      {
        liveFingerprint: r.chart.liveFingerprint,
        liveSnapshot: r.chart.liveSnapshot as Snapshot | null,
        archivedAt: r.chart.archivedAt,
      },
      current ? { ...current, snapshot: current.snapshot as Snapshot } : null,
    );
    return {
      postingId: r.posting.id,
      roomId: r.posting.roomId,
      room: r.room,
      postedAt: r.posting.postedAt,
      postedByName: r.postedByName,
      lastStatus: r.posting.lastStatus,
      edition: { id: r.edition.id, number: r.edition.number },
      chart: { id: r.chart.id, title: r.chart.title },
      status: result.status,
      changes: result.changes.map((c) => c.detail),
      current: current ? { id: current.id, number: current.number } : null,
    };
  });
}
