"use client";

import { useState } from "react";
import { saveBalloonAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { useImpactGate } from "@/components/stock/impact-gate";
import { useServerAction } from "@/components/ui/use-server-action";
import { formatMm } from "@/lib/stock/format";
import type { BalloonView } from "@/lib/stock/types";

/** Read-only roles see the word and a mark; managers get a switch that saves at once. */
export function InStockToggle({
  slug,
  family,
  balloon,
  canEdit,
  onSaved,
  onError,
}: {
  slug: string;
  family: string;
  balloon: BalloonView;
  canEdit: boolean;
  onSaved: (message: string) => void;
  onError: (message: string) => void;
}) {
  const [shown, setShown] = useState(balloon.inStock);
  const { run, pending } = useServerAction(saveBalloonAction, { refresh: false });
  const [gate, impactDialog] = useImpactGate(slug);
  const label = (on: boolean) => (
    <>
      <span aria-hidden className="inline-block w-4 text-center font-bold">
        {on ? "✓" : "✕"}
      </span>
      {on ? "In stock" : "Out of stock"}
    </>
  );
  if (!canEdit)
    return (
      <span className={`inline-flex items-center gap-1 ${shown ? "text-ok" : "text-ink-faint"}`}>{label(shown)}</span>
    );

  const toggle = async () => {
    const next = !shown;
    if (!(await gate({ balloons: [{ id: balloon.id, inStock: next }] }, next ? "Mark in stock" : "Mark out of stock")))
      return;
    setShown(next);
    const res = await run({ slug, balloonId: balloon.id, inStock: next });
    if (res.ok) onSaved(`${family} ${formatMm(balloon.diameterMm)} mm marked ${next ? "in stock" : "out of stock"}.`);
    else {
      setShown(!next);
      onError(res.message ?? "The change was not saved.");
    }
  };
  return (
    <>
      {impactDialog}
      <button
        type="button"
        role="switch"
        aria-checked={shown}
        aria-label={`${family} ${formatMm(balloon.diameterMm)} mm in stock`}
        onClick={toggle}
        disabled={pending}
        className={`inline-flex min-w-32 items-center gap-1 rounded-full border px-3 py-1 text-sm font-medium ${
          shown ? "border-ok/50 bg-ok-soft text-ok" : "border-line-strong bg-paper-sunk text-ink-soft"
        } disabled:opacity-60`}
      >
        {label(shown)}
      </button>
    </>
  );
}
