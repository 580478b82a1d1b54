"use client";

import { useRouter } from "next/navigation";
import { useActionState, useState, useTransition } from "react";
import {
  archiveRoomAction,
  createRoomAction,
  renameRoomAction,
  takeDownAction,
} from "@/app/(lab)/labs/[slug]/rooms/actions";
import { Button } from "@/components/ui/button";
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
  const [state, action, pending] = useActionState(createRoomAction.bind(null, slug), {});
  return (
    <form action={action} className="flex flex-wrap items-end gap-2">
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
  const router = useRouter();
  const [pending, start] = useTransition();
  const [state, setState] = useState<ActionState | null>(null);
  const [editing, setEditing] = useState(false);
  const [value, setValue] = useState(name);
  const run = (fn: () => Promise<ActionState>) =>
    start(async () => {
      const res = await fn();
      setState(res);
      if (res.ok) {
        setEditing(false);
        router.refresh();
      }
    });
  return (
    <div className="flex flex-wrap items-center gap-2">
      {editing ? (
        <form
          className="flex gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            run(() => renameRoomAction(slug, roomId, value));
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
        onClick={() => {
          if (window.confirm(`Remove the room "${name}"?`)) run(() => archiveRoomAction(slug, roomId));
        }}
      >
        Remove
      </Button>
      <Notice state={state} />
    </div>
  );
}

export function TakeDownButton({ slug, postingId, label }: { slug: string; postingId: number; label: string }) {
  const router = useRouter();
  const [pending, start] = useTransition();
  return (
    <Button
      variant="secondary"
      className="py-1 text-sm"
      disabled={pending}
      aria-label={`Taken down: ${label}`}
      onClick={() =>
        start(async () => {
          const res = await takeDownAction(slug, postingId);
          if (res.ok) router.refresh();
        })
      }
    >
      Taken down
    </Button>
  );
}
