"use client";

import { useEffect, useState } from "react";
import { DatabaseOutage } from "@/components/shell/outage";
import { Button } from "@/components/ui/button";

// A page failed while rendering. The server already logged it; in production the browser gets
// no details, so ask /api/health whether the database is the cause and say so plainly.
export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const [db, setDb] = useState<"checking" | "ok" | "down">("checking");
  useEffect(() => {
    let live = true;
    fetch("/api/health", { cache: "no-store" })
      .then((r) => (live ? setDb(r.ok ? "ok" : "down") : undefined))
      .catch(() => (live ? setDb("down") : undefined));
    return () => {
      live = false;
    };
  }, [error]);

  const retry = <Button onClick={() => reset()}>Try again</Button>;
  if (db === "down")
    return (
      <DatabaseOutage>
        <div className="mt-4">{retry}</div>
      </DatabaseOutage>
    );
  return (
    <div role="alert" className="mx-auto max-w-xl rounded-card border border-line bg-paper-raised p-6">
      <h1 className="text-xl font-semibold">Something went wrong on our side</h1>
      <p className="mt-2 text-ink-soft">
        This page could not be shown. Nothing you were doing has been half-saved: a change is either stored whole or not
        at all. Try again; if it keeps happening, tell your lab&apos;s manager
        {error.digest ? (
          <>
            {" "}
            and quote the reference <code className="rounded bg-paper-sunk px-1">{error.digest}</code>
          </>
        ) : null}
        .
      </p>
      <div className="mt-4">{retry}</div>
    </div>
  );
}
