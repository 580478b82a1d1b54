import Link from "next/link";
import type { FirstRunStep } from "@/lib/labs/first-run";

/** The new lab's checklist on its overview: each step says what is there or missing, and links to it. */
export function FirstRun({ steps }: { steps: FirstRunStep[] }) {
  const left = steps.filter((s) => !s.done).length;
  return (
    <section aria-labelledby="first-run-h" className="rounded-card border border-brand-200 bg-paper-raised p-5">
      <h2 id="first-run-h" className="text-lg font-semibold">
        Getting your lab started: {left === 0 ? "all done" : `${left} of ${steps.length} steps left`}
      </h2>
      <ol className="mt-3 space-y-3">
        {steps.map((step, i) => (
          <li key={step.key} className="flex gap-3" data-testid={`first-run-${step.key}`} data-done={step.done}>
            <span
              aria-hidden
              className={`mt-0.5 inline-flex h-6 w-6 shrink-0 items-center justify-center rounded-full border text-sm ${
                step.done ? "border-ok bg-ok-soft" : "border-line-strong"
              }`}
            >
              {step.done ? "✓" : i + 1}
            </span>
            <div>
              <p className="font-medium">
                {step.title}
                <span className="sr-only">{step.done ? " (done)" : " (to do)"}</span>
              </p>
              <p className="text-sm text-ink-soft">{step.state}</p>
              {step.done ? null : (
                <p className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-sm">
                  {step.links.map((l) => (
                    <Link key={l.href} href={l.href} className="text-brand-700 underline">
                      {l.label}
                    </Link>
                  ))}
                </p>
              )}
            </div>
          </li>
        ))}
      </ol>
    </section>
  );
}
