import "server-only";
import { getCheckByToken } from "@/lib/ops/check";
import * as postings from "@/db/queries/postings";
import * as rooms from "@/db/queries/rooms";
import { isAppError, notFound } from "@/lib/errors";
import { authorize } from "./access";
import { checkTokenSchema } from "@/lib/validation/check";
import { postingSchema, roomSchema } from "@/lib/validation/room";
import type { Caller } from "./caller";
import { labOperation } from "./operation";
import { labWrite } from "./write";

// Rooms and postings: where printed editions hang, and the record of each copy on a wall.

export const roomBoard = labOperation({
  name: "room.board",
  capability: "lab:read",
  scope: "lab",
  run: ({ labId }) => rooms.roomBoard({ labId }),
});

export const createRoom = labOperation({
  name: "room.create",
  capability: "rooms:manage",
  scope: "lab",
  input: roomSchema,
  run: async ({ labId, actor }, { name }) => {
    const { id } = await labWrite(labId, (tx) => rooms.createRoom(tx, { labId, name, actor }));
    return { id, name };
  },
});

export const renameRoom = labOperation({
  name: "room.rename",
  capability: "rooms:manage",
  scope: "lab",
  ids: { roomId: "Room" },
  input: roomSchema,
  run: async ({ labId, actor, ids }, { name }) => {
    await labWrite(labId, (tx) => rooms.renameRoom(tx, { labId, roomId: ids.roomId, name, actor }));
    return { id: ids.roomId, name };
  },
});

export const archiveRoom = labOperation({
  name: "room.archive",
  capability: "rooms:manage",
  scope: "lab",
  ids: { roomId: "Room" },
  run: async ({ labId, actor, ids }) => {
    await labWrite(labId, (tx) => rooms.archiveRoom(tx, { labId, roomId: ids.roomId, actor }));
    return null;
  },
});

/** "This copy hangs in ...": any member records it; a repeat answers the existing posting. */
export const recordPosting = labOperation({
  name: "posting.create",
  capability: "posting:record",
  scope: "edition",
  input: postingSchema,
  run: async ({ labId, actor, ids }, { roomId }) => {
    const res = await labWrite(labId, (tx) =>
      postings.recordPosting(tx, { labId, editionId: ids.editionId, roomId, actor }),
    );
    return { id: res.id, editionId: ids.editionId, roomId, created: res.created };
  },
});

export const takeDownPosting = labOperation({
  name: "posting.remove",
  capability: "posting:record",
  scope: "lab",
  ids: { postingId: "Posting" },
  run: async ({ labId, actor, ids }) => {
    await labWrite(labId, (tx) => postings.takeDownPosting(tx, { labId, postingId: ids.postingId, actor }));
    return null;
  },
});

/** Puts back a copy recorded as taken down by mistake, within a day. */
export const restorePosting = labOperation({
  name: "posting.restore",
  capability: "posting:record",
  scope: "lab",
  ids: { postingId: "Posting" },
  run: async ({ labId, actor, ids }) => {
    await labWrite(labId, (tx) => postings.restorePosting(tx, { labId, postingId: ids.postingId, actor }));
    return null;
  },
});

/** Copies taken down in the last day, which can still be put back. */
export const recentlyTakenDown = labOperation({
  name: "posting.recently_removed",
  capability: "lab:read",
  scope: "lab",
  run: ({ labId }) => postings.listRecentlyTakenDown({ labId }),
});

/** The public check: anyone with the poster's QR code may read it; a malformed token reads as unknown. */
export async function checkByToken(_caller: Caller, { token }: { token: string }) {
  if (!checkTokenSchema.safeParse(token).success) throw notFound("Check");
  const view = await getCheckByToken({ token });
  if (!view) throw notFound("Check");
  return view;
}

/**
 * The check page: the public answer for anyone, and for members of the edition's lab also the
 * rooms and where this copy is recorded as hanging (members may record postings there).
 */
export async function checkPage(caller: Caller, { token }: { token: string }) {
  const view = await checkByToken(caller, { token });
  const member =
    caller.kind === "user"
      ? await authorize(caller, { labId: view.lab.id }, "lab:read").catch((err: unknown) => {
          if (isAppError(err) && err.status === 404) return null;
          throw err;
        })
      : null;
  if (!member) return { view, role: null, rooms: [], hanging: [] };
  const [roomRows, hanging] = await Promise.all([
    rooms.listRooms({ labId: view.lab.id }),
    rooms.listPostingsForEdition({ labId: view.lab.id, editionId: view.edition.id }),
  ]);
  return { view, role: member.role, rooms: roomRows, hanging };
}
