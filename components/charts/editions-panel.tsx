"use client";

import { useState } from "react";
import {
  approveEditionAction,
  createEditionAction,
  rejectEditionAction,
  withdrawEditionAction,
} from "@/app/(lab)/labs/[slug]/charts/actions";
import { Button, buttonClass } from "@/components/ui/button";
import { StatusBadge } from "@/components/ui/status-badge";
import { useConfirm } from "@/components/ui/dialog";
import { useServerAction, type Action } from "@/components/ui/use-server-action";
import type { EditionStatus } from "@/lib/editions/states";
import { formatDate, formatDateTime } from "@/lib/format/dates";

export type EditionRow = {
  id: number;
  number: number;
  status: EditionStatus;
  fingerprint: string;
  createdByName: string | null;
  createdByMe: boolean;
  createdAt: string;
  approvedAt: string | null;
  approvedByName: string | null;
  reviewBy: string | null;
  rejectionReason: string | null;
  checkUrl: string;
  pdfUrl: string;
  matchesToday: boolean;
};

export function EditionsPanel({
  slug,
  chartId,
  editions,
  can,
  timeZone,
}: {
  slug: string;
  chartId: number;
  editions: EditionRow[];
  /** archive: managers may download the archive copy (the poster as approved, stamped as such). */
  can: { create: boolean; approve: boolean; withdraw: boolean; archive?: boolean };
  /** The lab's IANA time zone: dates are shown in it. */
  timeZone: string;
}) {
  const date = (iso: string) => formatDateTime(new Date(iso), timeZone);
  const { run: runAction, pending, state: notice } = useServerAction(createEditionAction);
  const [rejecting, setRejecting] = useState<number | null>(null);
  const [reason, setReason] = useState("");
  // The approver states the review before the approve button works (sent as reviewed: true).
  const [reviewed, setReviewed] = useState<number | null>(null);
  const [ask, confirmDialog] = useConfirm();

  const run = (action: Action, payload: Record<string, unknown>) =>
    void runAction({ slug, ...payload }, action).then((res) => {
      if (!res.ok) return;
      setRejecting(null);
      setReason("");
    });

  return (
    <section aria-labelledby="editions-h" className="mt-10">
      {confirmDialog}
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="editions-h" className="text-xl font-semibold">
          Editions
        </h2>
        {can.create ? (
          <Button onClick={() => run(createEditionAction, { chartId })} disabled={pending}>
            {pending ? "Working…" : "Create edition"}
          </Button>
        ) : null}
      </div>
      <p className="mt-1 text-sm text-ink-soft">
        An edition freezes the chart with today&apos;s stock. Someone other than its author approves it before it is
        printed for the wall.
      </p>
      {notice?.message ? (
        <p
          role={notice.ok ? "status" : "alert"}
          className={`mt-3 rounded-md border px-3 py-2 text-sm ${notice.ok ? "border-ok/40 bg-ok-soft" : "border-danger/40 bg-danger-soft text-danger"}`}
        >
          {notice.message}
          {notice.fieldErrors?.reason ? ` ${notice.fieldErrors.reason}` : ""}
        </p>
      ) : null}
      {editions.length === 0 ? (
        <p className="mt-4 rounded-md border border-dashed border-line-strong p-4 text-ink-soft">No editions yet.</p>
      ) : (
        <ul className="mt-4 space-y-3">
          {editions.map((e) => (
            <li
              key={e.id}
              className="rounded-card border border-line bg-paper-raised p-4"
              data-testid={`edition-${e.number}`}
            >
              <div className="flex flex-wrap items-center gap-3">
                <span className="text-lg font-semibold">Edition {e.number}</span>
                <StatusBadge status={e.status} />
                {e.status === "approved" && !e.matchesToday ? (
                  <StatusBadge status="outdated" label="Stock or settings changed since" />
                ) : null}
                <span className="font-mono text-xs text-ink-faint" title={e.fingerprint}>
                  {e.fingerprint.slice(0, 12)}
                </span>
              </div>
              <p className="mt-1 text-sm text-ink-soft">
                Drafted by {e.createdByName ?? "a former member"} on {date(e.createdAt)}
                {e.approvedAt ? ` · approved by ${e.approvedByName} on ${date(e.approvedAt)}` : ""}
                {e.reviewBy && e.status === "approved"
                  ? ` · due for review by ${formatDate(new Date(e.reviewBy), timeZone)}`
                  : ""}
              </p>
              {e.rejectionReason && e.status === "returned" ? (
                <p className="mt-1 text-sm text-warn">Sent back: {e.rejectionReason}</p>
              ) : null}
              <div className="mt-3 flex flex-wrap gap-2">
                <a href={e.pdfUrl} className={buttonClass("secondary", "py-1.5")} download>
                  Download PDF
                </a>
                <details className="text-sm" data-testid={`office-paper-${e.number}`}>
                  <summary className={buttonClass("ghost", "py-1.5")}>Print on office paper</summary>
                  <p className="mt-2 text-ink-soft">
                    The poster at full size over several sheets, with an assembly map, alignment marks and 10 mm
                    overlaps. Print at actual size.
                  </p>
                  <div className="mt-2 flex flex-wrap gap-2">
                    {(
                      [
                        ["A4", "A4 sheets"],
                        ["A3", "A3 sheets"],
                        ["LETTER", "US Letter sheets"],
                        ["TABLOID", "Tabloid sheets"],
                      ] as const
                    ).map(([tiles, label]) => (
                      <a
                        key={tiles}
                        href={`${e.pdfUrl}?tiles=${tiles}`}
                        className={buttonClass("secondary", "py-1.5")}
                        download
                      >
                        {label}
                      </a>
                    ))}
                    <a href={`${e.pdfUrl}?format=card`} className={buttonClass("secondary", "py-1.5")} download>
                      Badge card (two sides)
                    </a>
                    {can.archive && e.status !== "draft" && e.status !== "returned" ? (
                      <a href={`${e.pdfUrl}?copy=archive`} className={buttonClass("ghost", "py-1.5")} download>
                        Archive copy (as approved)
                      </a>
                    ) : null}
                  </div>
                </details>
                {e.status !== "draft" && e.status !== "returned" ? (
                  <a href={e.checkUrl} className={buttonClass("ghost", "py-1.5")}>
                    Check page
                  </a>
                ) : null}
                {e.status === "draft" ? (
                  <a href={`/labs/${slug}/sign-off/${e.id}`} className={buttonClass("ghost", "py-1.5")}>
                    Review changes
                  </a>
                ) : null}
                {can.approve && e.status === "draft" && !e.createdByMe ? (
                  <>
                    <label className="flex basis-full items-center gap-2 text-sm">
                      <input
                        type="checkbox"
                        checked={reviewed === e.id}
                        onChange={(ev) => setReviewed(ev.target.checked ? e.id : null)}
                      />
                      I have reviewed edition {e.number}: its numbers, cautions and notes, against the edition it
                      replaces.
                    </label>
                    <Button
                      onClick={() => run(approveEditionAction, { editionId: e.id, reviewed: true })}
                      disabled={pending || reviewed !== e.id}
                      className="py-1.5"
                    >
                      Approve edition {e.number}
                    </Button>
                    <Button
                      variant="secondary"
                      onClick={() => setRejecting(rejecting === e.id ? null : e.id)}
                      disabled={pending}
                      className="py-1.5"
                    >
                      Send back…
                    </Button>
                  </>
                ) : null}
                {can.approve && e.status === "draft" && e.createdByMe ? (
                  <span className="self-center text-sm text-ink-faint">
                    You drafted this; someone else who may approve signs it off.
                  </span>
                ) : null}
                {can.withdraw && e.status !== "withdrawn" && e.status !== "returned" ? (
                  <Button
                    variant="ghost"
                    className="py-1.5 text-danger"
                    disabled={pending}
                    onClick={async () => {
                      const answer = await ask({
                        title: `Withdraw edition ${e.number}?`,
                        body: (
                          <p>
                            Its check page will tell anyone who scans a posted copy to take it down, and it can no
                            longer be printed as current. This cannot be undone.
                          </p>
                        ),
                        reason: "Why is it withdrawn? (shown on the check page and in the audit log)",
                        confirm: "Withdraw edition",
                        danger: true,
                      });
                      if (answer) run(withdrawEditionAction, { editionId: e.id, reason: answer.reason });
                    }}
                  >
                    Withdraw
                  </Button>
                ) : null}
              </div>
              {rejecting === e.id ? (
                <form
                  className="mt-3 flex flex-wrap items-end gap-2"
                  onSubmit={(ev) => {
                    ev.preventDefault();
                    run(rejectEditionAction, { editionId: e.id, reason });
                  }}
                >
                  <label className="min-w-64 flex-1 text-sm font-medium">
                    Reason for sending it back
                    <input
                      value={reason}
                      onChange={(ev) => setReason(ev.target.value)}
                      className="mt-1 w-full rounded-md border border-line-strong px-3 py-2"
                      required
                      minLength={3}
                      maxLength={500}
                    />
                  </label>
                  <Button type="submit" variant="secondary" disabled={pending}>
                    Send back
                  </Button>
                </form>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
