"use client";

import { useState } from "react";
import { recordPostingAction, takeDownPostingAction } from "@/app/(public)/v/[token]/actions";
import { Button } from "@/components/ui/button";
import { useServerAction } from "@/components/ui/use-server-action";

export function PostingForm({
  token,
  rooms,
  hanging,
  canPost,
}: {
  token: string;
  rooms: { id: number; name: string }[];
  /** `postedOn`: the date it went up, already written in the lab's time zone. */
  hanging: { postingId: number; roomName: string; postedOn: string }[];
  canPost: boolean;
}) {
  const [roomId, setRoomId] = useState(rooms[0]?.id ?? 0);
  const { run, pending, state } = useServerAction(recordPostingAction);
  return (
    <section aria-labelledby="posting-h" className="mt-8 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="posting-h" className="font-semibold">
        Where this copy hangs
      </h2>
      {hanging.length ? (
        <ul className="mt-2 space-y-1">
          {hanging.map((h) => (
            <li key={h.postingId} className="flex flex-wrap items-center gap-2">
              <span>{h.roomName}</span>
              <span className="text-sm text-ink-faint">since {h.postedOn}</span>
              <Button
                variant="ghost"
                className="py-1 text-sm"
                disabled={pending}
                onClick={() => void run({ token, postingId: h.postingId }, takeDownPostingAction)}
              >
                Taken down
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="mt-1 text-sm text-ink-soft">No room recorded for this copy yet.</p>
      )}
      {canPost ? (
        rooms.length ? (
          <form
            className="mt-3 flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              void run({ token, roomId });
            }}
          >
            <label className="text-sm font-medium">
              This copy hangs in
              <select
                value={roomId}
                onChange={(e) => setRoomId(Number(e.target.value))}
                className="mt-1 block min-h-11 rounded-md border border-line-strong bg-white px-3 py-2"
              >
                {rooms.map((r) => (
                  <option key={r.id} value={r.id}>
                    {r.name}
                  </option>
                ))}
              </select>
            </label>
            <Button type="submit" disabled={pending}>
              {pending ? "Saving…" : "Record"}
            </Button>
          </form>
        ) : (
          <p className="mt-2 text-sm text-ink-soft">The lab has no rooms yet; a manager adds them on the Rooms page.</p>
        )
      ) : null}
      {state?.message ? (
        <p role={state.ok ? "status" : "alert"} className={`mt-2 text-sm ${state.ok ? "text-ok" : "text-danger"}`}>
          {state.message}
        </p>
      ) : null}
    </section>
  );
}
