"use client";

import { useCallback, useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button } from "@/components/ui/button";

/** A modal on the native <dialog>: focus is trapped, Escape closes, focus returns to the opener. */
export function Dialog({
  open,
  title,
  onClose,
  children,
}: {
  open: boolean;
  title: string;
  onClose: () => void;
  children: ReactNode;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-card border border-line bg-paper-raised p-6 text-ink shadow-xl backdrop:bg-ink/40"
    >
      <h2 id={titleId} className="text-lg font-semibold">
        {title}
      </h2>
      {open ? <div className="mt-4">{children}</div> : null}
    </dialog>
  );
}

export type ConfirmRequest = {
  title: string;
  /** What the action changes, in words the person can check before confirming. */
  body: ReactNode;
  /** The confirming button's words, e.g. "Take down"; the other button is "Cancel". */
  confirm: string;
  danger?: boolean;
  /** Asks for a reason in a text field (required before confirming), handed back on confirm. */
  reason?: string;
};

/** false when cancelled; on confirm the reason typed (empty when none was asked). */
export type ConfirmAnswer = false | { reason: string };

/**
 * An in-app confirmation in place of the browser's own pop-up: `await ask({...})` resolves to the
 * answer when confirmed, false when cancelled or closed; render `dialog` once in the component.
 */
export function useConfirm(): [(request: ConfirmRequest) => Promise<ConfirmAnswer>, ReactNode] {
  const [request, setRequest] = useState<(ConfirmRequest & { resolve: (a: ConfirmAnswer) => void }) | null>(null);
  const [reason, setReason] = useState("");
  const reasonId = useId();
  const ask = useCallback(
    (r: ConfirmRequest) =>
      new Promise<ConfirmAnswer>((resolve) => {
        setReason("");
        setRequest({ ...r, resolve });
      }),
    [],
  );
  const settle = (ok: boolean) => {
    request?.resolve(ok ? { reason: reason.trim() } : false);
    setRequest(null);
  };
  const missingReason = request?.reason !== undefined && reason.trim() === "";
  const dialog = (
    <Dialog open={request !== null} title={request?.title ?? ""} onClose={() => settle(false)}>
      <div className="space-y-4">
        <div>{request?.body}</div>
        {request?.reason !== undefined ? (
          <div>
            <label htmlFor={reasonId} className="block text-sm font-medium">
              {request.reason}
            </label>
            <textarea
              id={reasonId}
              rows={3}
              value={reason}
              onChange={(e) => setReason(e.target.value)}
              className="mt-1 w-full rounded-md border border-line-strong bg-white px-3 py-2"
            />
          </div>
        ) : null}
        <div className="flex flex-wrap justify-end gap-2">
          <Button type="button" variant="secondary" onClick={() => settle(false)} autoFocus>
            Cancel
          </Button>
          <Button
            type="button"
            variant={request?.danger ? "danger" : "primary"}
            onClick={() => settle(true)}
            disabled={missingReason}
          >
            {request?.confirm}
          </Button>
        </div>
      </div>
    </Dialog>
  );
  return [ask, dialog];
}
