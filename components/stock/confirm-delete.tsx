"use client";

import { Button } from "@/components/ui/button";
import { useServerAction, type Action } from "@/components/ui/use-server-action";
import type { ActionPayload } from "@/lib/http/action";

/** The confirmation step before a delete; the delete itself is one server action. */
export function ConfirmDelete({
  action,
  payload,
  what,
  consequence,
  onDone,
  onCancel,
}: {
  action: Action;
  payload: ActionPayload;
  what: string;
  consequence: string;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const { run, pending, state } = useServerAction(action, { refresh: false });
  const error = state && !state.ok ? state.message : null;
  const confirm = async () => {
    const res = await run(payload);
    if (res.ok) onDone(`Deleted ${what}.`);
  };
  return (
    <div className="space-y-4">
      <p>
        Delete <strong>{what}</strong>? {consequence}
      </p>
      <p className="text-sm text-ink-soft">
        The change is recorded in the stock history, and charts built from this stock will need to be regenerated.
      </p>
      {error ? (
        <p role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-3 py-2 text-sm text-danger">
          {error}
        </p>
      ) : null}
      <div className="flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onCancel} autoFocus>
          Keep it
        </Button>
        <Button type="button" variant="danger" onClick={confirm} disabled={pending} aria-busy={pending}>
          {pending ? "Deleting…" : "Delete"}
        </Button>
      </div>
    </div>
  );
}
