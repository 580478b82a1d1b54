import { Caution } from "@/components/ui/caution";

export default function CheckNotFound() {
  return (
    <div className="mx-auto max-w-xl">
      <div role="alert" className="rounded-card border-2 border-danger bg-danger-soft p-6">
        <p className="text-sm font-semibold uppercase tracking-wide text-danger">Unverified</p>
        <h1 className="mt-1 text-xl font-semibold">Forkwall does not know this printout</h1>
        <p className="mt-2 text-ink">
          The code on this copy does not match any chart edition. Treat the printout as unverified and ask your lab for
          the current edition.
        </p>
      </div>
      <Caution className="mt-8" />
    </div>
  );
}
