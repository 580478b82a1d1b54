import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { STALE } from "@/lib/editions/check";
import { AppError, notFound } from "@/lib/errors";
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
