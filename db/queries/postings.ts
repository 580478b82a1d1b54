import "server-only";
import { and, desc, eq, gt, isNotNull, isNull } from "drizzle-orm";
import { STALE } from "@/lib/editions/check";
import { AppError, notFound } from "@/lib/errors";
import { db } from "../index";
import { charts, editions, postings, rooms } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";
import { initialPostingStatus, reconcilePostings } from "./notices";

export { readPostings, type PostingView } from "./postings-read";

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
