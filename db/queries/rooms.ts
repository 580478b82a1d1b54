import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { STALE, type CheckStatus } from "@/lib/editions/check";
import { AppError, notFound } from "@/lib/errors";
import { db } from "../index";
import { postings, rooms } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";
import { readPostings } from "./postings-read";

export async function listRooms({ labId }: { labId: number }) {
  return db
    .select()
    .from(rooms)
    .where(and(eq(rooms.labId, labId), isNull(rooms.archivedAt)))
    .orderBy(asc(rooms.name));
}

export async function createRoom(tx: Tx, { labId, name, actor }: { labId: number; name: string; actor: Actor }) {
  const [dupe] = await tx
    .select({ id: rooms.id, archivedAt: rooms.archivedAt })
    .from(rooms)
    .where(and(eq(rooms.labId, labId), eq(rooms.name, name)));
  if (dupe && !dupe.archivedAt)
    throw new AppError("conflict", `There is already a room called "${name}".`, [
      { path: ["name"], message: "Already exists" },
    ]);
  let id: number;
  if (dupe) {
    await tx
      .update(rooms)
      .set({ archivedAt: null })
      .where(and(eq(rooms.id, dupe.id), eq(rooms.labId, labId)));
    id = dupe.id;
  } else {
    const [row] = await tx.insert(rooms).values({ labId, name }).$returningId();
    id = row!.id;
  }
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "room.created",
    targetType: "room",
    targetId: id,
    detail: { after: { name } },
  });
  return { id };
}

export async function renameRoom(
  tx: Tx,
  {
    labId,
    roomId,
    name,
    actor,
  }: {
    labId: number;
    roomId: number;
    name: string;
    actor: Actor;
  },
) {
  const [room] = await tx
    .select()
    .from(rooms)
    .where(and(eq(rooms.id, roomId), eq(rooms.labId, labId), isNull(rooms.archivedAt)));
  if (!room) throw notFound("Room");
  const [dupe] = await tx
    .select({ id: rooms.id })
    .from(rooms)
    .where(and(eq(rooms.labId, labId), eq(rooms.name, name)));
  if (dupe && dupe.id !== roomId)
    throw new AppError("conflict", `There is already a room called "${name}".`, [
      { path: ["name"], message: "Already exists" },
    ]);
  await tx
    .update(rooms)
    .set({ name })
    .where(and(eq(rooms.id, roomId), eq(rooms.labId, labId)));
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "room.renamed",
    targetType: "room",
    targetId: roomId,
    detail: { before: { name: room.name }, after: { name } },
  });
}

/** A room is archived, not deleted, so past postings keep their place in the audit log. */
export async function archiveRoom(tx: Tx, { labId, roomId, actor }: { labId: number; roomId: number; actor: Actor }) {
  const [room] = await tx
    .select()
    .from(rooms)
    .where(and(eq(rooms.id, roomId), eq(rooms.labId, labId), isNull(rooms.archivedAt)));
  if (!room) throw notFound("Room");
  const [hanging] = await tx
    .select({ id: postings.id })
    .from(postings)
    .where(and(eq(postings.roomId, roomId), isNull(postings.removedAt)))
    .limit(1);
  if (hanging) throw new AppError("conflict", `Take down the printouts in "${room.name}" before removing the room.`);
  await tx
    .update(rooms)
    .set({ archivedAt: new Date() })
    .where(and(eq(rooms.id, roomId), eq(rooms.labId, labId)));
  await recordAudit({
    tx,
    labId,
    actorUserId: actor.id,
    action: "room.archived",
    targetType: "room",
    targetId: roomId,
    detail: { before: { name: room.name } },
  });
}

export type BoardPosting = {
  postingId: number;
  postedAt: Date;
  postedByName: string | null;
  editionId: number;
  editionNumber: number;
  chartId: number;
  chartTitle: string;
  status: CheckStatus;
  changes: string[];
  currentEdition: { id: number; number: number } | null;
};
export type BoardRoom = { id: number; name: string; postings: BoardPosting[]; stale: number };

/** Every room, what hangs there and its status, stale rooms first: one query for the lab. */
export async function roomBoard({ labId }: { labId: number }): Promise<BoardRoom[]> {
  const [roomRows, copies] = await Promise.all([listRooms({ labId }), readPostings(db, labId)]);
  const stale = (p: BoardPosting) => STALE.includes(p.status);
  const board = roomRows.map((room): BoardRoom => {
    const mine = copies
      .filter((c) => c.roomId === room.id)
      .map((c): BoardPosting => ({
        postingId: c.postingId,
        postedAt: c.postedAt,
        postedByName: c.postedByName,
        editionId: c.edition.id,
        editionNumber: c.edition.number,
        chartId: c.chart.id,
        chartTitle: c.chart.title,
        status: c.status,
        changes: c.changes,
        currentEdition: c.current,
      }))
      .sort((a, b) => Number(stale(b)) - Number(stale(a)));
    return { id: room.id, name: room.name, postings: mine, stale: mine.filter(stale).length };
  });
  return board.sort((a, b) => b.stale - a.stale || a.name.localeCompare(b.name));
}

export async function listPostingsForEdition({ labId, editionId }: { labId: number; editionId: number }) {
  return db
    .select({ postingId: postings.id, roomName: rooms.name, postedAt: postings.postedAt })
    .from(postings)
    .innerJoin(rooms, eq(rooms.id, postings.roomId))
    .where(and(eq(postings.labId, labId), eq(postings.editionId, editionId), isNull(postings.removedAt)))
    .orderBy(asc(rooms.name));
}
