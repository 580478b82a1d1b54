import Link from "next/link";
import type { RuleIssue } from "@/lib/labs/rules";
import { RULE_LABELS, type RuleId } from "@/lib/labs/rules";

/** Why a chart cannot be approved under the lab's rules, and the exceptions its poster will print. */
export function RuleIssues({
  slug,
  issues,
  applied,
}: {
  slug: string;
  issues: RuleIssue[];
  applied: { rule: string; reason: string }[];
}) {
  if (!issues.length && !applied.length) return null;
  return (
    <section aria-labelledby="rules-h" className="mt-8 rounded border border-line p-4">
      <h2 id="rules-h" className="text-lg font-semibold">
        Lab rules
      </h2>
      {issues.length > 0 && (
        <div role="status" className="mt-2">
          <p className="font-medium text-danger">
            This chart is outside the lab&apos;s rules, so its editions cannot be approved:
          </p>
          <ul className="mt-1 list-disc pl-5">
            {issues.map((i) => (
              <li key={`${i.rule}:${i.path.join(".")}`}>{i.message}</li>
            ))}
          </ul>
          <p className="mt-2 text-sm text-ink-soft">
            Change the chart to fit the rules, or ask the medical lead to record an exception with a reason on the{" "}
            <Link className="underline" href={`/labs/${slug}/rules`}>
              rules page
            </Link>
            .
          </p>
        </div>
      )}
      {applied.length > 0 && (
        <div className="mt-2">
          <p className="font-medium">Exceptions the medical lead recorded (printed on the poster):</p>
          <ul className="mt-1 list-disc pl-5">
            {applied.map((e) => (
              <li key={e.rule}>
                {RULE_LABELS[e.rule as RuleId] ?? e.rule}: {e.reason}
              </li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}
