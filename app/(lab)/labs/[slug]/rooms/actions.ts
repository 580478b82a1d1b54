"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { archiveRoom, createRoom, renameRoom, takeDownPosting } from "@/db/queries/rooms";
import { memberAction, type ActionState } from "@/lib/auth/action-guard";
import { idParam } from "@/lib/validation/edition";
import { roomSchema } from "@/lib/validation/room";

const path = (slug: string) => `/labs/${slug}/rooms`;

export async function createRoomAction(slug: string, _prev: ActionState, form: FormData): Promise<ActionState> {
  return memberAction(slug, "rooms:manage", roomSchema, form, async (member, { name }) => {
    await createRoom({ labId: member.lab.id, name, actor: member.user });
    revalidatePath(path(slug));
    return { ok: true, message: `Room "${name}" added.` };
  });
}

export async function renameRoomAction(slug: string, roomId: number, name: string): Promise<ActionState> {
  return memberAction(
    slug,
    "rooms:manage",
    roomSchema.extend({ roomId: idParam }),
    { roomId, name },
    async (member, data) => {
      await renameRoom({ labId: member.lab.id, roomId: data.roomId, name: data.name, actor: member.user });
      revalidatePath(path(slug));
      return { ok: true, message: `Renamed to "${data.name}".` };
    },
  );
}

export async function archiveRoomAction(slug: string, roomId: number): Promise<ActionState> {
  return memberAction(
    slug,
    "rooms:manage",
    z.object({ roomId: idParam }).strict(),
    { roomId },
    async (member, data) => {
      await archiveRoom({ labId: member.lab.id, roomId: data.roomId, actor: member.user });
      revalidatePath(path(slug));
      return { ok: true, message: "Room removed." };
    },
  );
}

export async function takeDownAction(slug: string, postingId: number): Promise<ActionState> {
  return memberAction(
    slug,
    "posting:record",
    z.object({ postingId: idParam }).strict(),
    { postingId },
    async (member, data) => {
      await takeDownPosting({ labId: member.lab.id, postingId: data.postingId, actor: member.user });
      revalidatePath(path(slug));
      return { ok: true, message: "Recorded as taken down." };
    },
  );
}
