import type { Chosen } from "@/lib/calculator/choice";
import type { LabCell, LocalSolve } from "@/lib/calculator/local";
import { lookupTitle } from "@/lib/poster/labels";
import { cornerSymbols, MARKS } from "@/lib/poster/marks";
import { lawName } from "@/lib/sizing";
import { field } from "./fields";

type Answer = LocalSolve | LabCell;

/** The answer, shown under the inputs once both diameters are typed; nothing before that. */
export function ResultPanel({ answer, chosen }: { answer: Answer | null; chosen: Chosen | null }) {
  if (!answer) return null;
  return (
    <section
      aria-live="polite"
      aria-label="Result"
      className="rounded-card border-2 border-brand-700 bg-paper-raised p-4 sm:p-5"
    >
      {!answer.ok ? (
        <div role="alert">
          <p className="font-semibold text-danger">
            {"code" in answer && answer.code === "no_solution" ? "No size" : "Check the input"}
          </p>
          <p className="mt-1">{answer.message}</p>
        </div>
      ) : "view" in answer ? (
        <LabResult answer={answer} chosen={chosen!} />
      ) : (
        <SolveResult answer={answer} />
      )}
      {answer.ok ? (
        <p className="mt-3 border-t border-line pt-2 text-base text-ink-soft">
          Reference aid only: confirm by imaging and the device&apos;s own compliance chart (full caution below).
        </p>
      ) : null}
    </section>
  );
}

function LabResult({ answer, chosen }: { answer: Extract<LabCell, { ok: true }>; chosen: Chosen }) {
  const { view } = answer;
  const { chart } = chosen;
  return (
    <div data-testid="lab-result">
      <p className="text-base text-ink-soft">
        {lookupTitle(chosen.lookup.kind)} · {chart.title} · edition {chart.edition.number}
      </p>
      <p className="text-5xl font-bold tabular-nums text-brand-800" data-testid="lab-size">
        {view.primary}
        {view.primaryIsSize ? <span className="text-2xl font-semibold"> mm</span> : null}
        {cornerSymbols(view) ? <span className="ml-2 align-top text-2xl">{cornerSymbols(view)}</span> : null}
      </p>
      {view.pressure ? (
        <p className="text-xl font-semibold" data-testid="lab-pressure">
          {view.pressure}
        </p>
      ) : null}
      {answer.exactLabel ? (
        <p className="mt-1 text-base tabular-nums text-ink-soft">Exact by the law: {answer.exactLabel} mm</p>
      ) : null}
      {view.marks.length ? (
        <ul className="mt-2 list-disc pl-5 text-base" data-testid="lab-marks">
          {view.marks.map((m) => (
            <li key={m}>
              <strong>
                {MARKS[m].symbol} {MARKS[m].label}
              </strong>
            </li>
          ))}
        </ul>
      ) : null}
      <p className="mt-2 text-base">{view.description}</p>
      <p className="mt-2 text-base text-ink-soft" data-testid="lab-edition">
        As edition {chart.edition.number} of {chosen.lab.name}&apos;s chart prints it ({lawName(chart.snapshot.law)}).
        {chart.edition.current ? null : (
          <strong className="text-warn">
            {" "}
            The lab&apos;s stock or settings changed since this edition was approved: confirm the size.
          </strong>
        )}
      </p>
    </div>
  );
}

function SolveResult({ answer }: { answer: Extract<LocalSolve, { ok: true }> }) {
  return (
    <div>
      <p className="text-base text-ink-soft">{field(answer.solved).label}</p>
      <p className="text-5xl font-bold tabular-nums text-brand-800" data-testid="solve-result">
        {answer.diameterLabel} <span className="text-2xl font-semibold">mm</span>
      </p>
      <p className="mt-3 font-mono text-base [overflow-wrap:anywhere]">{answer.formula}</p>
      {answer.warnings.length ? (
        <ul className="mt-3 list-disc pl-5 text-base text-warn">
          {answer.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
