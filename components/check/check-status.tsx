import { actionSentence } from "@/lib/editions/action";
import { CHECK_HEADLINES, type CheckStatus } from "@/lib/editions/check";
import { rewordedSentence, type CheckJson } from "@/lib/editions/check-json";
import { formatDate } from "@/lib/format/dates";

// A symbol and a word for every status: colour is never the only signal.
const LOOK: Record<CheckStatus, { symbol: string; cls: string }> = {
  current: { symbol: "✓", cls: "border-ok bg-ok-soft text-ok" },
  outdated: { symbol: "!", cls: "border-warn bg-warn-soft text-warn" },
  superseded: { symbol: "↻", cls: "border-warn bg-warn-soft text-warn" },
  withdrawn: { symbol: "✕", cls: "border-danger bg-danger-soft text-danger" },
  draft: { symbol: "✎", cls: "border-danger bg-danger-soft text-danger" },
};

const day = (iso: string | null, timeZone: string) => (iso ? formatDate(new Date(iso), timeZone) : null);

/** The status block of the check page: plain server HTML, readable without JavaScript. */
export function CheckStatusView({ check }: { check: CheckJson }) {
  const look = LOOK[check.status];
  const since = day(check.since, check.lab.timeZone);
  return (
    <div>
      <p className="text-sm text-ink-soft">
        {check.lab.name} · {check.chart.title} · edition {check.edition.number}
      </p>
      <div
        className={`mt-3 rounded-card border-4 px-5 py-6 ${look.cls}`}
        data-testid="check-status"
        data-status={check.status}
      >
        {/* The status word scales with the screen so "Superseded" fits a 320 px phone whole. */}
        <p className="flex items-center gap-3 text-[clamp(1.5rem,8.5vw,3.75rem)] font-bold leading-none">
          <span
            aria-hidden
            className="inline-flex h-11 w-11 shrink-0 items-center justify-center rounded-full border-4 border-current text-3xl sm:h-14 sm:w-14 sm:text-4xl"
          >
            {look.symbol}
          </span>
          <span className="min-w-0 [overflow-wrap:anywhere]">{CHECK_HEADLINES[check.status]}</span>
        </p>
        {since ? (
          <p className="mt-3 text-base font-medium text-ink">
            {check.status === "current"
              ? "Approved"
              : check.status === "outdated"
                ? "Stock or settings last changed"
                : check.status === "draft"
                  ? "Drafted"
                  : "Since"}{" "}
            {since}
          </p>
        ) : null}
      </div>
      <p className="mt-4 text-lg font-semibold" data-testid="check-action" data-action={check.action}>
        {actionSentence(check.action, {
          reviewBy: check.reviewBy ? new Date(check.reviewBy) : null,
          replacement: check.currentEdition,
          timeZone: check.lab.timeZone,
        })}
      </p>
      {check.rewordedEdition ? (
        <p className="mt-2 text-base" data-testid="check-reworded">
          {rewordedSentence(check.rewordedEdition)}
        </p>
      ) : null}
      {check.changes.length ? (
        <section className="mt-4" aria-labelledby="changes-h">
          <h2 id="changes-h" className="text-base font-semibold">
            What changed
          </h2>
          <ul className="mt-2 list-disc space-y-1 pl-5" data-testid="check-changes">
            {check.changes.map((c, i) => (
              <li key={i}>{c.detail}</li>
            ))}
          </ul>
        </section>
      ) : null}
      {check.currentEdition ? (
        <p className="mt-4 text-ink-soft">
          The current edition of this chart is edition {check.currentEdition.number}
          {check.currentEdition.approvedAt
            ? `, approved ${day(check.currentEdition.approvedAt, check.lab.timeZone)}`
            : ""}
          .
        </p>
      ) : null}
    </div>
  );
}
