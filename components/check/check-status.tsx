import { ACTION_HEADINGS, actionSentence, type CopyAction } from "@/lib/editions/action";
import { CHECK_HEADLINES } from "@/lib/editions/check";
import { rewordedSentence, type CheckJson } from "@/lib/editions/check-json";
import { formatDate } from "@/lib/format/dates";

// One colour, symbol and border per action (as the plain check page, lib/editions/check-html.ts).
const LOOK: Record<CopyAction, { symbol: string; cls: string }> = {
  keep: { symbol: "✓", cls: "border-solid border-ok bg-ok-soft text-ok" },
  replace: { symbol: "↻", cls: "border-dashed border-warn bg-warn-soft text-warn" },
  "take-down": { symbol: "✕", cls: "border-double border-[7px] border-danger bg-danger-soft text-danger" },
  review: { symbol: "?", cls: "border-dotted border-review bg-review-soft text-review" },
};

const DATE_WORD: Partial<Record<CheckJson["status"], string>> = {
  current: "Approved",
  outdated: "Stock or settings last changed",
  draft: "Drafted",
};

const day = (iso: string | null, timeZone: string) => (iso ? formatDate(new Date(iso), timeZone) : null);

/** The check page's verdict: the action first, then the status and the reasons, each once. Plain server HTML. */
export function CheckStatusView({ check }: { check: CheckJson }) {
  const look = LOOK[check.action];
  const tz = check.lab.timeZone;
  const since = day(check.since, tz);
  const current = check.currentEdition;
  return (
    <div>
      <p className="text-base text-ink-soft">
        {check.lab.name} · {check.chart.title} · edition {check.edition.number}
      </p>
      <div
        className={`mt-3 rounded-card border-4 px-5 py-5 ${look.cls}`}
        data-testid="check-verdict"
        data-action={check.action}
      >
        <div className="flex items-center gap-3 text-[clamp(1.6rem,8.5vw,3rem)] font-bold leading-tight">
          <span
            aria-hidden
            className="inline-flex h-11 w-11 shrink-0 items-center justify-center rounded-full border-4 border-current text-3xl"
          >
            {look.symbol}
          </span>
          <h1 className="min-w-0 [overflow-wrap:anywhere]">{ACTION_HEADINGS[check.action]}</h1>
        </div>
        <p className="mt-3 text-lg font-semibold text-ink" data-testid="check-action" data-action={check.action}>
          {actionSentence(check.action, {
            reviewBy: check.reviewBy ? new Date(check.reviewBy) : null,
            replacement: current
              ? { number: current.number, approvedAt: current.approvedAt ? new Date(current.approvedAt) : null }
              : null,
            timeZone: tz,
            contactLine: check.lab.contactLine,
          })}
        </p>
      </div>
      <p className="mt-4 text-base" data-testid="check-status" data-status={check.status}>
        Status: <strong>{CHECK_HEADLINES[check.status]}</strong>
        {since ? (
          <>
            {" · "}
            <span data-testid="check-date">
              {DATE_WORD[check.status] ?? "Since"} {since}
            </span>
          </>
        ) : null}
        {check.status === "withdrawn" || check.status === "draft" ? (
          <strong> Do not rely on this printout&apos;s numbers.</strong>
        ) : null}
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
      {current && check.action !== "replace" ? (
        <p className="mt-4 text-base text-ink-soft">
          The current edition of this chart is edition {current.number}
          {current.approvedAt ? `, approved ${day(current.approvedAt, tz)}` : ""}.
        </p>
      ) : null}
    </div>
  );
}
