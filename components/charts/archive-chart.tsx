"use client";

import { useState } from "react";
import { archiveChartAction } from "@/app/(lab)/labs/[slug]/charts/actions";
import { Button } from "@/components/ui/button";
import { useServerAction } from "@/components/ui/use-server-action";

/** Archive with a confirmation step that says what happens to the copies on the wall. */
export function ArchiveChart({ slug, chartId, title }: { slug: string; chartId: number; title: string }) {
  const { run, pending, state } = useServerAction(archiveChartAction);
  const [confirming, setConfirming] = useState(false);
  return (
    <section aria-labelledby="archive-h" className="mt-10 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="archive-h" className="text-lg font-semibold">
        Archive this chart
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        An archived chart leaves the chart lists and gets no new editions; its editions are kept. Every posted
        copy&apos;s check page then says to take it down.
      </p>
      {state?.message ? (
        <p
          role={state.ok ? "status" : "alert"}
          className={`mt-3 rounded-md border px-3 py-2 text-sm ${state.ok ? "border-ok/40 bg-ok-soft" : "border-danger/40 bg-danger-soft text-danger"}`}
        >
          {state.message}
        </p>
      ) : null}
      {state?.ok ? null : confirming ? (
        <div className="mt-3 flex flex-wrap items-center gap-2" role="group" aria-label="Confirm archiving">
          <span className="basis-full text-sm font-semibold">
            Archive &quot;{title}&quot;? Posted copies will read &quot;take down&quot;.
          </span>
          <Button variant="danger" disabled={pending} onClick={() => void run({ slug, chartId })}>
            {pending ? "Working…" : "Yes, archive it"}
          </Button>
          <Button variant="secondary" disabled={pending} onClick={() => setConfirming(false)}>
            Cancel
          </Button>
        </div>
      ) : (
        <Button variant="secondary" className="mt-3" onClick={() => setConfirming(true)}>
          Archive chart…
        </Button>
      )}
    </section>
  );
}
