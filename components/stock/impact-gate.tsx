"use client";

import { useCallback, type ReactNode } from "react";
import { stockImpactAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { useConfirm } from "@/components/ui/dialog";
import { UNREACHABLE } from "@/components/ui/use-server-action";
import type { ActionPayload, ActionState } from "@/lib/http/action";
import { impactSentence, type Outdate } from "@/lib/stock/impact";

/** What a change would outdate on the wall, said before it is saved: a warning when copies go stale. */
export function ImpactNotice({ outdates }: { outdates: Outdate[] }) {
  const stale = outdates.length > 0;
  return (
    <div
      role="status"
      data-testid="impact"
      className={`rounded-md border px-3 py-2 text-sm ${stale ? "border-warn/50 bg-warn-soft" : "border-line bg-paper-sunk"}`}
    >
      <p className="font-medium">
        {stale ? <span aria-hidden>⚠ </span> : null}
        {impactSentence(outdates)}
      </p>
      {stale ? (
        <ul className="mt-1 list-disc pl-5">
          {outdates.map((o) => (
            <li key={o.editionId}>
              {o.title}: {o.rooms.join(", ")}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** Asks the server what a change would outdate; `null` when it could not say (the save then reports). */
export async function askImpact(
  action: (prev: ActionState, payload: ActionPayload) => Promise<ActionState>,
  payload: ActionPayload,
): Promise<Outdate[] | null> {
  const res = await action({}, payload).catch(() => UNREACHABLE);
  return res.ok ? ((res.data as { outdates: Outdate[] }).outdates ?? []) : null;
}

/**
 * Before a stock change: when it would outdate posted copies, an in-app dialog says which and
 * asks; otherwise it goes ahead at once. `gate(change, verb)` resolves true to save.
 */
export function useImpactGate(slug: string): [(change: object, verb: string) => Promise<boolean>, ReactNode] {
  const [ask, dialog] = useConfirm();
  const gate = useCallback(
    async (change: object, verb: string) => {
      const outdates = await askImpact(stockImpactAction, { slug, ...change });
      if (!outdates?.length) return true;
      const answer = await ask({
        title: "Posted copies will go out of date",
        body: <ImpactNotice outdates={outdates} />,
        confirm: verb,
        danger: true,
      });
      return answer !== false;
    },
    [ask, slug],
  );
  return [gate, dialog];
}
