"use client";

import useSWR from "swr";
import type { CheckJson } from "@/lib/editions/check-json";
import { CheckStatusView } from "./check-status";

const fetchJson = async (url: string): Promise<CheckJson> => {
  const res = await fetch(url, { cache: "no-store" });
  if (!res.ok) throw new Error(`check failed: ${res.status}`);
  return res.json();
};

/** Keeps the status fresh while the page stays open on a phone; the server HTML already shows it. */
export function LiveCheck({ token, initial }: { token: string; initial: CheckJson }) {
  const { data, error } = useSWR(`/api/v1/check/${token}`, fetchJson, {
    fallbackData: initial,
    refreshInterval: 30_000,
    revalidateOnFocus: true,
  });
  return (
    <div aria-live="polite">
      <CheckStatusView check={data ?? initial} />
      {error ? (
        <p className="mt-2 text-sm text-ink-faint">Could not refresh just now; showing the status as loaded.</p>
      ) : null}
    </div>
  );
}
