"use client";

import { useState } from "react";
import { archiveChartAction, restoreChartAction } from "@/app/(lab)/labs/[slug]/charts/actions";
import { Button } from "@/components/ui/button";
import { FormStatus } from "@/components/ui/form-status";
import { useServerAction } from "@/components/ui/use-server-action";

/**
 * Archive a chart (with a confirmation step that says what happens to the copies on the wall) or
 * restore an archived one. One panel for both, so the outcome stays on screen when the page's
 * refreshed data turns it from one into the other.
 */
export function ChartArchive({
  slug,
  chartId,
  title,
  archived,
}: {
  slug: string;
  chartId: number;
  title: string;
  archived: boolean;
}) {
  const { run, pending, state } = useServerAction(archiveChartAction);
  const [confirming, setConfirming] = useState(false);
  const archive = async () => {
    if ((await run({ slug, chartId })).ok) setConfirming(false);
  };
  return (
    <section aria-labelledby="archive-h" className="mt-10 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="archive-h" className="text-lg font-semibold">
        {archived ? "Restore this chart" : "Archive this chart"}
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        {archived ? (
          <>
            The chart returns to the chart lists and can get new editions. Its posted copies&apos; check pages stop
            saying &quot;take down&quot; and say again whether each copy is current.
          </>
        ) : (
          <>
            An archived chart leaves the chart lists and gets no new editions; its editions are kept. Every posted
            copy&apos;s check page then says to take it down.
          </>
        )}
      </p>
      <FormStatus ok={state?.ok} message={state?.message} className="mt-3" />
      {archived ? (
        <Button
          variant="secondary"
          className="mt-3"
          disabled={pending}
          onClick={() => void run({ slug, chartId }, restoreChartAction)}
        >
          {pending ? "Working…" : "Restore chart"}
        </Button>
      ) : confirming ? (
        <div className="mt-3 flex flex-wrap items-center gap-2" role="group" aria-label="Confirm archiving">
          <span className="basis-full text-sm font-semibold">
            Archive &quot;{title}&quot;? Posted copies will read &quot;take down&quot;.
          </span>
          <Button variant="danger" disabled={pending} onClick={() => void archive()}>
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
