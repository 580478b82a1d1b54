import "server-only";
import { and, asc, desc, eq, isNull } from "drizzle-orm";
import type { Snapshot } from "@/lib/charts/snapshot";
import { checkEdition, STALE, type CheckStatus } from "@/lib/editions/check";
import { AppError, notFound } from "@/lib/errors";
import { db } from "../index";
import { charts, editions, postings, rooms, users } from "../schema";
import { recordAudit } from "./audit";
import { initialPostingStatus } from "./notices";

type Actor = { id: number };

export async function listRooms({ labId }: { labId: number }) {
  return db.select().from(rooms).where(and(eq(rooms.labId, labId), isNull(rooms.archivedAt))).orderBy(asc(rooms.name));
}

export async function createRoom({ labId, name, actor }: { labId: number; name: string; actor: Actor }) {
  return db.transaction(async (tx) => {
    const [dupe] = await tx.select({ id: rooms.id, archivedAt: rooms.archivedAt }).from(rooms).where(and(eq(rooms.labId, labId), eq(rooms.name, name)));
    if (dupe && !dupe.archivedAt) throw new AppError("conflict", `There is already a room called "${name}".`, [{ path: ["name"], message: "Already exists" }]);
    let id: number;
    if (dupe) {
      await tx.update(rooms).set({ archivedAt: null }).where(and(eq(rooms.id, dupe.id), eq(rooms.labId, labId)));
      id = dupe.id;
    } else {
      const [row] = await tx.insert(rooms).values({ labId, name }).$returningId();
      id = row!.id;
    }
    await recordAudit({ tx, labId, actorUserId: actor.id, action: "room.created", targetType: "room", targetId: id, detail: { after: { name } } });
    return { id };
  });
}

export async function renameRoom({ labId, roomId, name, actor }: { labId: number; roomId: number; name: string; actor: Actor }) {
  return db.transaction(async (tx) => {
    const [room] = await tx.select().from(rooms).where(and(eq(rooms.id, roomId), eq(rooms.labId, labId), isNull(rooms.archivedAt)));
    if (!room) throw notFound("Room");
    const [dupe] = await tx.select({ id: rooms.id }).from(rooms).where(and(eq(rooms.labId, labId), eq(rooms.name, name)));
    if (dupe && dupe.id !== roomId) throw new AppError("conflict", `There is already a room called "${name}".`, [{ path: ["name"], message: "Already exists" }]);
    await tx.update(rooms).set({ name }).where(and(eq(rooms.id, roomId), eq(rooms.labId, labId)));
    await recordAudit({ tx, labId, actorUserId: actor.id, action: "room.renamed", targetType: "room", targetId: roomId, detail: { before: { name: room.name }, after: { name } } });
  });
}

/** A room is archived, not deleted, so past postings keep their place in the audit log. */
export async function archiveRoom({ labId, roomId, actor }: { labId: number; roomId: number; actor: Actor }) {
  return db.transaction(async (tx) => {
    const [room] = await tx.select().from(rooms).where(and(eq(rooms.id, roomId), eq(rooms.labId, labId), isNull(rooms.archivedAt)));
    if (!room) throw notFound("Room");
    const [hanging] = await tx.select({ id: postings.id }).from(postings).where(and(eq(postings.roomId, roomId), isNull(postings.removedAt))).limit(1);
    if (hanging) throw new AppError("conflict", `Take down the printouts in "${room.name}" before removing the room.`);
    await tx.update(rooms).set({ archivedAt: new Date() }).where(and(eq(rooms.id, roomId), eq(rooms.labId, labId)));
    await recordAudit({ tx, labId, actorUserId: actor.id, action: "room.archived", targetType: "room", targetId: roomId, detail: { before: { name: room.name } } });
  });
}

/** "This copy hangs in ...": only an approved edition may be recorded on a wall. */
export async function recordPosting({ labId, editionId, roomId, actor }: { labId: number; editionId: number; roomId: number; actor: Actor }) {
  return db.transaction(async (tx) => {
    const [ed] = await tx.select({ id: editions.id, number: editions.number, status: editions.status }).from(editions).where(and(eq(editions.id, editionId), eq(editions.labId, labId)));
    if (!ed) throw notFound("Edition");
    if (ed.status !== "approved") throw new AppError("conflict", `Edition ${ed.number} is ${ed.status}; only an approved edition may hang on a wall.`);
    const [room] = await tx.select({ id: rooms.id, name: rooms.name }).from(rooms).where(and(eq(rooms.id, roomId), eq(rooms.labId, labId), isNull(rooms.archivedAt)));
    if (!room) throw new AppError("invalid_input", "Choose one of this lab's rooms.", [{ path: ["roomId"], message: "No such room in this lab" }]);
    const [already] = await tx
      .select({ id: postings.id })
      .from(postings)
      .where(and(eq(postings.editionId, editionId), eq(postings.roomId, roomId), isNull(postings.removedAt)));
    if (already) return { id: already.id, created: false };
    const lastStatus = await initialPostingStatus(tx, { labId, editionId });
    const [row] = await tx.insert(postings).values({ labId, editionId, roomId, postedBy: actor.id, lastStatus }).$returningId();
    await recordAudit({ tx, labId, actorUserId: actor.id, action: "posting.created", targetType: "posting", targetId: row!.id, detail: { edition: ed.number, room: room.name } });
    return { id: row!.id, created: true };
  });
}

export async function takeDownPosting({ labId, postingId, actor }: { labId: number; postingId: number; actor: Actor }) {
  return db.transaction(async (tx) => {
    const [p] = await tx.select().from(postings).where(and(eq(postings.id, postingId), eq(postings.labId, labId), isNull(postings.removedAt)));
    if (!p) throw notFound("Posting");
    await tx.update(postings).set({ removedAt: new Date(), removedBy: actor.id }).where(and(eq(postings.id, postingId), eq(postings.labId, labId)));
    await recordAudit({ tx, labId, actorUserId: actor.id, action: "posting.removed", targetType: "posting", targetId: postingId, detail: { editionId: p.editionId, roomId: p.roomId } });
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
  const [roomRows, rows, approved] = await Promise.all([
    listRooms({ labId }),
    db
      .select({ posting: postings, edition: editions, chart: { id: charts.id, title: charts.title, liveFingerprint: charts.liveFingerprint, liveSnapshot: charts.liveSnapshot }, postedByName: users.name })
      .from(postings)
      .innerJoin(editions, eq(editions.id, postings.editionId))
      .innerJoin(charts, eq(charts.id, editions.chartId))
      .leftJoin(users, eq(users.id, postings.postedBy))
      .where(and(eq(postings.labId, labId), isNull(postings.removedAt)))
      .orderBy(desc(postings.postedAt)),
    db
      .select({ id: editions.id, chartId: editions.chartId, number: editions.number, approvedAt: editions.approvedAt })
      .from(editions)
      .where(and(eq(editions.labId, labId), eq(editions.status, "approved"))),
  ]);
  const board = roomRows.map((room): BoardRoom => {
    const mine = rows
      .filter((r) => r.posting.roomId === room.id)
      .map((r): BoardPosting => {
        const current = approved.find((a) => a.chartId === r.chart.id) ?? null;
        const result = checkEdition(
          { ...r.edition, snapshot: r.edition.snapshot as Snapshot },
          { liveFingerprint: r.chart.liveFingerprint, liveSnapshot: r.chart.liveSnapshot as Snapshot | null },
          current && current.id !== r.edition.id ? current : null,
        );
        return {
          postingId: r.posting.id,
          postedAt: r.posting.postedAt,
          postedByName: r.postedByName,
          editionId: r.edition.id,
          editionNumber: r.edition.number,
          chartId: r.chart.id,
          chartTitle: r.chart.title,
          status: result.status,
          changes: result.changes.map((c) => c.detail),
          currentEdition: current && current.id !== r.edition.id ? { id: current.id, number: current.number } : null,
        };
      })
      .sort((a, b) => Number(STALE.includes(b.status)) - Number(STALE.includes(a.status)));
    return { id: room.id, name: room.name, postings: mine, stale: mine.filter((p) => STALE.includes(p.status)).length };
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
