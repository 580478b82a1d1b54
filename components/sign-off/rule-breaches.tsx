import Link from "next/link";
import type { Breach } from "@/lib/editions/breaches";

/** The lab-rule breaches approval would refuse, listed before anyone presses Approve. */
export function RuleBreaches({ breaches, slug }: { breaches: Breach[]; slug: string }) {
  return (
    <section
      aria-labelledby="breaches-h"
      data-testid="rule-breaches"
      className={`rounded-card border p-4 ${breaches.length ? "border-danger/40 bg-danger-soft" : "border-line bg-paper-raised"}`}
    >
      <h2 id="breaches-h" className="text-lg font-semibold">
        {breaches.length
          ? `Lab rules: ${breaches.length} ${breaches.length === 1 ? "breach" : "breaches"} without an exception`
          : "Lab rules: no breach"}
      </h2>
      {breaches.length ? (
        <>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
            {breaches.map((b, i) => (
              <li key={i} className="break-words">
                {b.message}
              </li>
            ))}
          </ul>
          <p className="mt-2 text-sm">
            This edition cannot be approved while a breach has no exception: send it back, or the medical lead records
            an exception on the{" "}
            <Link href={`/labs/${slug}/rules`} className="text-brand-700 underline">
              rules page
            </Link>{" "}
            and a new edition is drafted.
          </p>
        </>
      ) : (
        <p className="mt-1 text-sm">The chart keeps every lab rule, or the medical lead recorded an exception.</p>
      )}
    </section>
  );
}
