"use client";

import { useEffect, useId, useMemo, useState } from "react";
import { readChoice, type CalculatorLab } from "@/lib/calculator/choice";
import { labCell, lawRecord, solveLocally, type LabCell, type LocalSolve } from "@/lib/calculator/local";
import { LOOKUP_VESSELS, lawName } from "@/lib/sizing";
import { ChartPicker } from "./chart-picker";
import { field, FIELDS, INPUT_CLASS, type LawOption, type Target } from "./fields";
import { LawFields, type LawState } from "./law-fields";
import { NumberField } from "./number-field";
import { ResultPanel } from "./result-panel";

/** A signed-in member's labs with their approved charts, loaded once; null for anyone else. */
function useCalculatorLabs() {
  const [labs, setLabs] = useState<CalculatorLab[] | null>(null);
  useEffect(() => {
    let live = true;
    fetch("/api/v1/calculator", { cache: "no-store" })
      .then((res) => (res.ok ? res.json() : null))
      .then((body: { labs: CalculatorLab[] } | null) => {
        if (live && body) setLabs(body.labs.filter((l) => l.charts.length > 0));
      })
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, []);
  return labs;
}

/**
 * The calculator computes in the browser (lib/calculator/local.ts): nothing is sent per change,
 * and it keeps answering if the network drops. The inputs come first; the answer appears under
 * them once both diameters are typed.
 */
export function Calculator({ laws }: { laws: LawOption[] }) {
  const id = useId();
  const [lawState, setLawState] = useState<LawState>({ law: "finet", ratio: "0.678", n: "2.3", solveFor: "parent" });
  const [values, setValues] = useState<Record<Target, string>>({ parent: "", mb: "", sb: "" });
  const labs = useCalculatorLabs();
  const [choice, setChoice] = useState("");
  const chosen = useMemo(() => readChoice(labs, choice), [choice, labs]);

  const target: Target = chosen ? LOOKUP_VESSELS[chosen.lookup.kind].solved : lawState.solveFor;
  const given = FIELDS.filter((f) => f.key !== target);
  const ready = given.every((f) => values[f.key].trim() !== "");

  const answer: LocalSolve | LabCell | null = useMemo(() => {
    if (!ready) return null;
    if (chosen) return labCell(chosen.chart.snapshot, chosen.lookup, values);
    const record: Record<string, string> = { law: lawState.law };
    if (lawState.law === "finet") record.ratio = lawState.ratio.trim();
    if (lawState.law === "power") record.n = lawState.n.trim();
    for (const f of given) record[f.key] = values[f.key].trim().replace(",", ".");
    return solveLocally(record);
  }, [ready, chosen, values, lawState, given]);

  const issueFor = (key: string) =>
    answer && !answer.ok ? answer.issues.find((i) => i.path[0] === key)?.text : undefined;
  const source = laws.find((l) => l.id === lawState.law)?.source;

  return (
    <div className="mt-4 flex flex-col gap-5">
      {labs && labs.length ? <ChartPicker id={`${id}-lab`} labs={labs} value={choice} onChange={setChoice} /> : null}
      {chosen ? null : (
        <LawFields
          id={id}
          laws={laws}
          state={lawState}
          onChange={(next) => setLawState((old) => ({ ...old, ...next }))}
          issueFor={issueFor}
        />
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        {given.map((f) => (
          <NumberField
            key={f.key}
            id={`${id}-${f.key}`}
            label={`${f.label} (${f.hint}), mm`}
            value={values[f.key]}
            onChange={(v) => setValues((old) => ({ ...old, [f.key]: v }))}
            error={issueFor(f.key)}
            className={INPUT_CLASS}
          />
        ))}
      </div>
      {ready ? null : (
        <p className="text-base text-ink-soft" data-testid="calculator-waiting">
          Type both diameters to see the {field(target).label.toLowerCase()}.
        </p>
      )}
      <ResultPanel answer={answer} chosen={chosen} />
      {chosen ? (
        <p className="text-base text-ink-soft">
          Law: {lawName(chosen.chart.snapshot.law)} ({Object.values(lawRecord(chosen.chart.snapshot.law)).join(", ")})
        </p>
      ) : source ? (
        <p className="text-base text-ink-soft">Source: {source}</p>
      ) : null}
    </div>
  );
}
