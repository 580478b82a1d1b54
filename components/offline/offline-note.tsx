"use client";

import { useEffect, useState } from "react";

const FETCHED_AT = "x-forkwall-fetched-at";

/** "Offline: as of <time of last check>", shown only while the device is offline. */
export function OfflineNote() {
  const [note, setNote] = useState<string | null>(null);
  useEffect(() => {
    const update = async () => {
      if (navigator.onLine) return setNote(null);
      const hit = await caches?.match(location.origin + location.pathname).catch(() => undefined);
      const at = hit?.headers.get(FETCHED_AT);
      const when = at
        ? new Date(at).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" })
        : "the last time it loaded";
      setNote(`Offline: as of ${when}`);
    };
    void update();
    window.addEventListener("online", update);
    window.addEventListener("offline", update);
    return () => {
      window.removeEventListener("online", update);
      window.removeEventListener("offline", update);
    };
  }, []);
  if (!note) return null;
  return (
    <p
      role="status"
      data-testid="offline-note"
      className="mb-2 rounded-md border-l-4 border-warn bg-warn-soft px-3 py-1 text-base font-semibold text-ink"
    >
      {note}. The lab may have changed this since; check again when back online.
    </p>
  );
}
