"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { approveEditionAction, rejectEditionAction } from "@/app/(lab)/labs/[slug]/charts/actions";
import { Button } from "@/components/ui/button";
import { useServerAction } from "@/components/ui/use-server-action";

/**
 * The approver's decision on one draft: approve only after stating the review (sent as
 * reviewed: true), or send it back with a reason. The server checks both again.
 */
export function SignOffForm({
  slug,
  editionId,
  number,
  changedCount,
  changedItems,
  breaches,
}: {
  slug: string;
  editionId: number;
  number: number;
  changedCount: number;
  /** Printed items (besides cells) that differ from the replaced edition. */
  changedItems: number;
  /** Lab-rule breaches without an exception: approval is refused while there is one. */
  breaches: number;
}) {
  const router = useRouter();
  const { run, pending, state } = useServerAction(approveEditionAction);
  const [reviewed, setReviewed] = useState(false);
  const [reason, setReason] = useState("");
  const [done, setDone] = useState(false);

  if (done && state?.ok)
    return (
      <div role="status" className="rounded-card border border-ok/40 bg-ok-soft p-4">
        <p className="font-semibold">{state.message}</p>
        <Link href={`/labs/${slug}/sign-off`} className="mt-2 inline-block text-brand-700 underline">
          Back to the sign-off queue
        </Link>
      </div>
    );

  const after = (p: Promise<{ ok?: boolean }>) =>
    void p.then((r) => {
      setDone(r.ok === true);
      // The page then tells the edition's new state from the database, not from this form.
      if (r.ok) router.refresh();
    });

  return (
    <div className="space-y-6">
      {state && !state.ok ? (
        <p role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-3 py-2 text-sm text-danger">
          {state.message}
          {state.fieldErrors?.reviewed ? ` ${state.fieldErrors.reviewed}` : ""}
          {state.fieldErrors?.reason ? ` ${state.fieldErrors.reason}` : ""}
        </p>
      ) : null}
      <form
        className="rounded-card border border-line bg-paper-raised p-4"
        aria-labelledby="approve-h"
        onSubmit={(ev) => {
          ev.preventDefault();
          if (breaches > 0) return;
          after(run({ slug, editionId, reviewed }, approveEditionAction));
        }}
      >
        <h2 id="approve-h" className="text-lg font-semibold">
          Approve edition {number}
        </h2>
        <label className="mt-3 flex items-start gap-3 text-sm">
          <input
            type="checkbox"
            name="reviewed"
            required
            className="mt-0.5 h-5 w-5 shrink-0"
            checked={reviewed}
            onChange={(ev) => setReviewed(ev.target.checked)}
          />
          <span>
            I have reviewed every changed cell ({changedCount} {changedCount === 1 ? "cell" : "cells"}) and everything
            edition {number} prints as listed on this page ({changedItems} changed{" "}
            {changedItems === 1 ? "item" : "items"}), including the caution, the notes and the exceptions in force.
          </span>
        </label>
        {breaches > 0 ? (
          <p className="mt-3 text-sm font-medium text-danger" data-testid="approve-blocked">
            Approve stays off: {breaches} lab-rule {breaches === 1 ? "breach has" : "breaches have"} no exception
            (listed above).
          </p>
        ) : null}
        <Button type="submit" className="mt-4 w-full sm:w-auto" disabled={pending || !reviewed || breaches > 0}>
          {pending ? "Working…" : `Approve edition ${number}`}
        </Button>
      </form>
      <form
        className="rounded-card border border-line bg-paper-raised p-4"
        aria-labelledby="return-h"
        onSubmit={(ev) => {
          ev.preventDefault();
          after(run({ slug, editionId, reason }, rejectEditionAction));
        }}
      >
        <h2 id="return-h" className="text-lg font-semibold">
          Send it back
        </h2>
        <label className="mt-3 block text-sm font-medium">
          Reason (the author reads it)
          <textarea
            name="reason"
            value={reason}
            onChange={(ev) => setReason(ev.target.value)}
            className="mt-1 w-full rounded-md border border-line-strong px-3 py-2"
            rows={3}
            required
            minLength={3}
            maxLength={500}
          />
        </label>
        <Button type="submit" variant="secondary" className="mt-3 w-full sm:w-auto" disabled={pending}>
          Send back
        </Button>
      </form>
    </div>
  );
}
