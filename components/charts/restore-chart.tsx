"use client";

import { restoreChartAction } from "@/app/(lab)/labs/[slug]/charts/actions";
import { Button } from "@/components/ui/button";
import { useServerAction } from "@/components/ui/use-server-action";

/** Restore an archived chart: one step, since it only undoes the archive and changes no number. */
export function RestoreChart({ slug, chartId }: { slug: string; chartId: number }) {
  const { run, pending, state } = useServerAction(restoreChartAction);
  return (
    <section aria-labelledby="restore-h" className="mt-10 rounded-card border border-line bg-paper-raised p-4">
      <h2 id="restore-h" className="text-lg font-semibold">
        Restore this chart
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        The chart returns to the chart lists and can get new editions. Its posted copies&apos; check pages stop saying
        &quot;take down&quot; and say again whether each copy is current.
      </p>
      {state?.message ? (
        <p
          role={state.ok ? "status" : "alert"}
          className={`mt-3 rounded-md border px-3 py-2 text-sm ${state.ok ? "border-ok/40 bg-ok-soft" : "border-danger/40 bg-danger-soft text-danger"}`}
        >
          {state.message}
        </p>
      ) : null}
      {state?.ok ? null : (
        <Button variant="secondary" className="mt-3" disabled={pending} onClick={() => void run({ slug, chartId })}>
          {pending ? "Working…" : "Restore chart"}
        </Button>
      )}
    </section>
  );
}
