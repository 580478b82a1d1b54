"use client";

import "./globals.css";

// The last resort, when even the root layout failed: it brings its own <html> and <body>.
export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body className="min-h-screen bg-paper font-sans text-ink antialiased">
        <main className="mx-auto w-full max-w-page px-gutter py-12">
          <div role="alert" className="mx-auto max-w-xl rounded-card border border-line bg-paper-raised p-6">
            <p className="text-lg font-bold text-brand-800">Forkwall</p>
            <h1 className="mt-2 text-xl font-semibold">Forkwall could not show this page</h1>
            <p className="mt-2 text-ink-soft">
              Something went wrong on our side, possibly because Forkwall cannot reach its database right now. If you
              were checking a printout, treat it as unverified until a check succeeds.
              {error.digest ? ` Reference: ${error.digest}.` : ""}
            </p>
            <button
              type="button"
              onClick={() => reset()}
              className="mt-4 rounded-md bg-brand-700 px-4 py-2 text-sm font-semibold text-white hover:bg-brand-800"
            >
              Try again
            </button>
          </div>
        </main>
      </body>
    </html>
  );
}
