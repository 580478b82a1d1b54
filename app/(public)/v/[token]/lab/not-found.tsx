import { Caution } from "@/components/ui/caution";

export default function CheckNotFound() {
  return (
    <div className="mx-auto max-w-xl">
      <div role="alert" className="rounded-card border-2 border-danger bg-danger-soft p-6">
        <p className="text-sm font-semibold uppercase tracking-wide text-danger">Unverified</p>
        <h1 className="mt-1 text-xl font-semibold">This code is not a Forkwall poster</h1>
        <p className="mt-2 text-ink">
          No chart edition has this code. Do not rely on the printout that carries it: ask your lab for its current
          approved chart.
        </p>
      </div>
      <Caution className="mt-8" />
    </div>
  );
}
