import Link from "next/link";

/** What a page shows while the database cannot be reached (pages answer 503 with it). */
export function DatabaseOutage({ children }: { children?: React.ReactNode }) {
  return (
    <div role="alert" className="mx-auto max-w-xl rounded-card border border-warn/40 bg-warn-soft p-6">
      <h1 className="text-xl font-semibold">Forkwall cannot reach its database right now</h1>
      <p className="mt-2 text-ink-soft">
        Please try again in a minute. Nothing you were doing has been half-saved: a change is either stored whole or not
        at all.
      </p>
      {children}
      <Link href="/calculator" className="mt-4 inline-block text-brand-700 underline">
        The calculator works without the database
      </Link>
    </div>
  );
}

/** The check page's answer when it cannot look the printout up: never a status, always "unverified". */
export function CheckUnavailable() {
  return (
    <div role="alert" className="mx-auto max-w-xl rounded-card border-2 border-danger bg-danger-soft p-6">
      <p className="text-sm font-semibold uppercase tracking-wide text-danger">Unverified</p>
      <h1 className="mt-1 text-xl font-semibold">This printout cannot be verified right now</h1>
      <p className="mt-2 text-ink">
        Forkwall cannot reach its database, so it cannot say whether this copy is current. Treat the printout as
        unverified: do not rely on its numbers until a check succeeds. Try again in a minute.
      </p>
    </div>
  );
}
