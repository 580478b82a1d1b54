"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { StockApiError, stockRequest } from "./stock-api";

/** The confirmation step before a delete; the delete itself is one API call. */
export function ConfirmDelete({
  url,
  what,
  consequence,
  onDone,
  onCancel,
}: {
  url: string;
  what: string;
  consequence: string;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const confirm = async () => {
    setPending(true);
    setError(null);
    try {
      await stockRequest("DELETE", url);
      onDone(`Deleted ${what}.`);
    } catch (err) {
      setError(err instanceof StockApiError ? err.message : "Something went wrong; nothing was deleted.");
      setPending(false);
    }
  };
  return (
    <div className="space-y-4">
      <p>
        Delete <strong>{what}</strong>? {consequence}
      </p>
      <p className="text-sm text-ink-soft">
        The change is recorded in the stock history, and charts built from this stock will need to be regenerated.
      </p>
      {error ? (
        <p role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-3 py-2 text-sm text-danger">
          {error}
        </p>
      ) : null}
      <div className="flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onCancel} autoFocus>
          Keep it
        </Button>
        <Button type="button" variant="danger" onClick={confirm} disabled={pending} aria-busy={pending}>
          {pending ? "Deleting…" : "Delete"}
        </Button>
      </div>
    </div>
  );
}
