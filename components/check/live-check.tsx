"use client";

import useSWR from "swr";
import type { CheckJson } from "@/lib/editions/check-json";
import { CheckUnavailable } from "@/components/shell/outage";
import { CheckStatusView } from "./check-status";

class CheckFailed extends Error {
  constructor(readonly status: number) {
    super(`check failed: ${status}`);
  }
}

const fetchJson = async (url: string): Promise<CheckJson> => {
  const res = await fetch(url, { cache: "no-store" });
  if (!res.ok) throw new CheckFailed(res.status);
  return res.json();
};

/** Keeps the status fresh while the page stays open on a phone; the server HTML already shows it. */
export function LiveCheck({ token, initial }: { token: string; initial: CheckJson }) {
  const { data, error } = useSWR(`/api/v1/check/${token}`, fetchJson, {
    fallbackData: initial,
    refreshInterval: 30_000,
    revalidateOnFocus: true,
  });
  // With the database out, the status loaded earlier can no longer be vouched for.
  if (error instanceof CheckFailed && error.status === 503)
    return (
      <div aria-live="polite">
        <CheckUnavailable />
      </div>
    );
  return (
    <div aria-live="polite">
      <CheckStatusView check={data ?? initial} />
      {error ? (
        <p className="mt-2 text-sm text-ink-faint">Could not refresh just now; showing the status as loaded.</p>
      ) : null}
    </div>
  );
}
