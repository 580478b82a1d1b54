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
};

/**
 * An in-app confirmation in place of the browser's own pop-up: `await ask({...})` resolves true
 * when confirmed, false when cancelled or closed; render `dialog` once in the component.
 */
export function useConfirm(): [(request: ConfirmRequest) => Promise<boolean>, ReactNode] {
  const [request, setRequest] = useState<(ConfirmRequest & { resolve: (ok: boolean) => void }) | null>(null);
  const ask = useCallback((r: ConfirmRequest) => new Promise<boolean>((resolve) => setRequest({ ...r, resolve })), []);
  const settle = (ok: boolean) => {
    request?.resolve(ok);
    setRequest(null);
  };
  const dialog = (
    <Dialog open={request !== null} title={request?.title ?? ""} onClose={() => settle(false)}>
      <div className="space-y-4">
        <div>{request?.body}</div>
        <div className="flex flex-wrap justify-end gap-2">
          <Button type="button" variant="secondary" onClick={() => settle(false)} autoFocus>
            Cancel
          </Button>
          <Button type="button" variant={request?.danger ? "danger" : "primary"} onClick={() => settle(true)}>
            {request?.confirm}
          </Button>
        </div>
      </div>
    </Dialog>
  );
  return [ask, dialog];
}
