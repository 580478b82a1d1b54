"use client";

import { useActionState, useState } from "react";
import {
  archiveRoomAction,
  createRoomAction,
  renameRoomAction,
  restorePostingAction,
  takeDownAction,
} from "@/app/(lab)/labs/[slug]/rooms/actions";
import { Button } from "@/components/ui/button";
import { useConfirm } from "@/components/ui/dialog";
import { useServerAction } from "@/components/ui/use-server-action";
import type { ActionState } from "@/lib/http/action";

function Notice({ state }: { state: ActionState | null }) {
  if (!state?.message) return null;
  return (
    <p role={state.ok ? "status" : "alert"} className={`text-sm ${state.ok ? "text-ok" : "text-danger"}`}>
      {state.message}
      {state.fieldErrors?.name && state.fieldErrors.name !== state.message ? ` ${state.fieldErrors.name}` : ""}
    </p>
  );
}

export function AddRoomForm({ slug }: { slug: string }) {
  const [state, action, pending] = useActionState(createRoomAction, {});
  return (
    <form action={action} className="flex flex-wrap items-end gap-2">
      <input type="hidden" name="slug" value={slug} />
      <label className="text-sm font-medium">
        New room
        <input
          name="name"
          required
          maxLength={120}
          defaultValue={state.ok ? "" : String(state.values?.name ?? "")}
          placeholder="e.g. Procedure room 2"
          className="mt-1 block w-64 rounded-md border border-line-strong bg-white px-3 py-2"
        />
      </label>
      <Button type="submit" disabled={pending}>
        {pending ? "Adding…" : "Add room"}
      </Button>
      <Notice state={state} />
    </form>
  );
}

export function RoomMenu({
  slug,
  roomId,
  name,
  empty,
}: {
  slug: string;
  roomId: number;
  name: string;
  empty: boolean;
}) {
  const rename = useServerAction(renameRoomAction);
  const archive = useServerAction(archiveRoomAction);
  const [ask, dialog] = useConfirm();
  const [editing, setEditing] = useState(false);
  const [value, setValue] = useState(name);
  const pending = rename.pending || archive.pending;
  return (
    <div className="flex flex-wrap items-center gap-2">
      {editing ? (
        <form
          className="flex gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            archive.reset();
            void rename.run({ slug, roomId, name: value }).then((res) => res.ok && setEditing(false));
          }}
        >
          <input
            aria-label={`New name for ${name}`}
            value={value}
            onChange={(e) => setValue(e.target.value)}
            className="rounded-md border border-line-strong px-2 py-1"
          />
          <Button type="submit" className="py-1" disabled={pending}>
            Save
          </Button>
        </form>
      ) : (
        <Button variant="ghost" className="py-1 text-sm" onClick={() => setEditing(true)}>
          Rename
        </Button>
      )}
      <Button
        variant="ghost"
        className="py-1 text-sm"
        disabled={pending || !empty}
        title={empty ? undefined : "Take the printouts down first"}
        onClick={async () => {
          const ok = await ask({
            title: `Remove the room "${name}"?`,
            body: <p>The room leaves the room board and can no longer take printouts. Its history stays.</p>,
            confirm: "Remove room",
            danger: true,
          });
          if (!ok) return;
          rename.reset();
          void archive.run({ slug, roomId });
        }}
      >
        Remove
      </Button>
      <Notice state={rename.state ?? archive.state} />
      {dialog}
    </div>
  );
}

/** Records that a copy came off the wall, after an in-app confirmation; undone on the board for a day. */
export function TakeDownButton({ slug, postingId, label }: { slug: string; postingId: number; label: string }) {
  const { run, pending } = useServerAction(takeDownAction);
  const [ask, dialog] = useConfirm();
  return (
    <>
      <Button
        variant="secondary"
        className="py-1 text-sm"
        disabled={pending}
        aria-label={`Record as taken down: ${label}`}
        onClick={async () => {
          const ok = await ask({
            title: "Record this copy as taken down?",
            body: (
              <p>
                {label} leaves this room&apos;s list of posted copies. Do this once the printout is off the wall. You
                can put it back on the list for a day.
              </p>
            ),
            confirm: "Record as taken down",
            danger: true,
          });
          if (ok) void run({ slug, postingId });
        }}
      >
        Record as taken down
      </Button>
      {dialog}
    </>
  );
}

/** Puts a copy taken down by mistake back on its room's list (within a day). */
export function RestoreButton({ slug, postingId, label }: { slug: string; postingId: number; label: string }) {
  const { run, pending, state } = useServerAction(restorePostingAction);
  return (
    <span className="flex items-center gap-2">
      <Button
        variant="secondary"
        className="py-1 text-sm"
        disabled={pending}
        aria-label={`Put back: ${label}`}
        onClick={() => void run({ slug, postingId })}
      >
        Put back
      </Button>
      {state && !state.ok ? <Notice state={state} /> : null}
    </span>
  );
}
