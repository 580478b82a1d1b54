"use client";

import { useRouter } from "next/navigation";
import { useCallback, useState, useTransition } from "react";
import type { ActionPayload, ActionState } from "@/lib/http/action";

export type Action = (prev: ActionState, payload: ActionPayload) => Promise<ActionState>;

export const UNREACHABLE: ActionState = {
  ok: false,
  message: "The server could not be reached or did not answer. Check your connection and try again.",
};

/**
 * Runs a server action from a button or table (forms use React's useActionState): `run(payload)`
 * resolves to the action's state, also kept in `state` (`run(payload, other)` runs another action
 * of the same panel and shares its state); a failed request reads as "nothing was
 * changed"; the page's server data is refreshed after a success unless `refresh` is false.
 */
export function useServerAction(action: Action, { refresh = true }: { refresh?: boolean } = {}) {
  const router = useRouter();
  const [state, setState] = useState<ActionState | null>(null);
  const [pending, start] = useTransition();
  const run = useCallback(
    (payload: ActionPayload, other: Action = action) =>
      new Promise<ActionState>((resolve) =>
        start(async () => {
          const res = await other({}, payload).catch(() => UNREACHABLE);
          setState(res);
          if (res.ok && refresh) router.refresh();
          resolve(res);
        }),
      ),
    [action, refresh, router],
  );
  return { run, pending, state, reset: () => setState(null) };
}
