import "server-only";
import { and, desc, eq, gt, isNotNull, isNull } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkEdition, STALE, type CheckStatus } from "@/lib/editions/check";
import { AppError, notFound } from "@/lib/errors";
import { db, type Database } from "../index";
import { charts, editions, postings, rooms, users } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";
import { initialPostingStatus, reconcilePostings } from "./notices";

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

/** "This copy hangs in ...": only an approved edition may be recorded on a wall. */
export async function recordPosting(
  tx: Tx,
  {
    labId,
    editionId,
    roomId,
    actor,
  }: {
    labId: number;
    editionId: number;
    roomId: number;
    actor: Actor;
  },
) {
  const [ed] = await tx
    .select({ id: editions.id, number: editions.number, status: editions.status })
    .from(editions)
    .where(and(eq(editions.id, editionId), eq(editions.labId, labId)));
  if (!ed) throw notFound("Edition");
  if (ed.status !== "approved")
    throw new AppError(
      "conflict",
      `Edition ${ed.number} is ${ed.status}; only an approved edition may hang on a wall.`,
    );
  const [room] = await tx
    .select({ id: rooms.id, name: rooms.name })
    .from(rooms)
    .where(and(eq(rooms.id, roomId), eq(rooms.labId, labId), isNull(rooms.archivedAt)));
  if (!room)
    throw new AppError("invalid_input", "Choose one of this lab's rooms.", [
      { path: ["roomId"], message: "No such room in this lab" },
    ]);
  const [already] = await tx
    .select({ id: postings.id })
    .from(postings)
    .where(and(eq(postings.editionId, editionId), eq(postings.roomId, roomId), isNull(postings.removedAt)));
  if (already) return { id: already.id, created: false };
  const lastStatus = await initialPostingStatus(tx, { labId, editionId });
  const [row] = await tx
    .insert(postings)
    .values({ labId, editionId, roomId, postedBy: actor.id, lastStatus })
    .$returningId();
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "posting.created",
    targetType: "posting",
    targetId: row!.id,
    detail: { edition: ed.number, room: room.name },
  });
  return { id: row!.id, created: true };
}

export async function takeDownPosting(
  tx: Tx,
  { labId, postingId, actor }: { labId: number; postingId: number; actor: Actor },
) {
  const [p] = await tx
    .select()
    .from(postings)
    .where(and(eq(postings.id, postingId), eq(postings.labId, labId), isNull(postings.removedAt)));
  if (!p) throw notFound("Posting");
  await tx
    .update(postings)
    .set({ removedAt: new Date(), removedBy: actor.id })
    .where(and(eq(postings.id, postingId), eq(postings.labId, labId)));
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "posting.removed",
    targetType: "posting",
    targetId: postingId,
    detail: { editionId: p.editionId, roomId: p.roomId },
  });
  // The last stale copy coming down leaves every wall right: the manager hears so, as when the
  // copies turn current again.
  if (STALE.includes(p.lastStatus)) {
    const [what] = await tx
      .select({ room: rooms.name, chart: charts.title, edition: editions.number })
      .from(postings)
      .innerJoin(rooms, eq(rooms.id, postings.roomId))
      .innerJoin(editions, eq(editions.id, postings.editionId))
      .innerJoin(charts, eq(charts.id, editions.chartId))
      .where(and(eq(postings.id, postingId), eq(postings.labId, labId)));
    await reconcilePostings(tx, {
      labId,
      changeKey: `posting:${postingId}:removed`,
      cause: `The ${p.lastStatus} printout of "${what!.chart}" (edition ${what!.edition}) was taken down in ${what!.room}.`,
      cleared: true,
    });
  }
}

/** How long a copy recorded as taken down can be put back on the list. */
export const RESTORE_WINDOW_MS = 24 * 60 * 60 * 1000;

/** Copies taken down within the restore window, newest first, with where and what they were. */
export async function listRecentlyTakenDown({ labId, now = new Date() }: { labId: number; now?: Date }) {
  return db
    .select({
      postingId: postings.id,
      removedAt: postings.removedAt,
      room: rooms.name,
      chartTitle: charts.title,
      editionNumber: editions.number,
    })
    .from(postings)
    .innerJoin(rooms, eq(rooms.id, postings.roomId))
    .innerJoin(editions, eq(editions.id, postings.editionId))
    .innerJoin(charts, eq(charts.id, editions.chartId))
    .where(
      and(
        eq(postings.labId, labId),
        isNull(rooms.archivedAt),
        gt(postings.removedAt, new Date(now.getTime() - RESTORE_WINDOW_MS)),
      ),
    )
    .orderBy(desc(postings.removedAt));
}

/**
 * Undoes a take-down within a day: the copy hangs again with the status it has now (no mail,
 * as when it is first recorded). A copy of the same edition hanging there since is a 409.
 */
export async function restorePosting(
  tx: Tx,
  { labId, postingId, actor, now = new Date() }: { labId: number; postingId: number; actor: Actor; now?: Date },
) {
  const [p] = await tx
    .select({ posting: postings, roomArchived: rooms.archivedAt })
    .from(postings)
    .innerJoin(rooms, eq(rooms.id, postings.roomId))
    .where(and(eq(postings.id, postingId), eq(postings.labId, labId), isNotNull(postings.removedAt)));
  if (!p) throw notFound("Posting");
  if (p.roomArchived || p.posting.removedAt!.getTime() < now.getTime() - RESTORE_WINDOW_MS)
    throw new AppError(
      "conflict",
      "A copy can be put back for a day after it was taken down; record it again instead.",
    );
  const lastStatus = await initialPostingStatus(tx, { labId, editionId: p.posting.editionId });
  await tx
    .update(postings)
    .set({ removedAt: null, removedBy: null, lastStatus })
    .where(and(eq(postings.id, postingId), eq(postings.labId, labId)));
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "posting.restored",
    targetType: "posting",
    targetId: postingId,
    detail: { editionId: p.posting.editionId, roomId: p.posting.roomId },
  });
}
