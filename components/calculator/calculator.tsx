"use client";

import { useEffect, useId, useMemo, useState } from "react";
import { labCell, lawRecord, solveLocally, type LabCell, type LocalSolve } from "@/lib/calculator/local";
import type { Snapshot } from "@/lib/charts/snapshot";
import { cornerSymbols, MARKS } from "@/lib/poster/marks";
import { lookupTitle } from "@/lib/poster/labels";
import { FINET_RATIO_MAX, FINET_RATIO_MIN, LOOKUP_VESSELS, lawName, POWER_N_MAX, POWER_N_MIN } from "@/lib/sizing";

type LawOption = { id: string; name: string; formula: string; source: string };
type Target = "parent" | "mb" | "sb";
type CalculatorLab = {
  slug: string;
  name: string;
  isDemo: boolean;
  charts: { id: number; title: string; snapshot: Snapshot }[];
};

const FIELDS: { key: Target; label: string; hint: string }[] = [
  { key: "parent", label: "Parent (proximal main vessel)", hint: "Dp" },
  { key: "mb", label: "Main branch", hint: "Dmb" },
  { key: "sb", label: "Side branch", hint: "Dsb" },
];
const field = (key: Target) => FIELDS.find((f) => f.key === key)!;

/**
 * The calculator computes in the browser (lib/calculator/local.ts): nothing is sent per change,
 * and it keeps answering if the network drops. A signed-in member's labs and their charts load
 * once; choosing one answers as that chart's cell would.
 */
export function Calculator({ laws }: { laws: LawOption[] }) {
  const id = useId();
  const [law, setLaw] = useState("finet");
  const [ratio, setRatio] = useState("0.678");
  const [n, setN] = useState("2.3");
  const [solveFor, setSolveFor] = useState<Target>("parent");
  const [values, setValues] = useState<Record<Target, string>>({ parent: "", mb: "3.5", sb: "2.5" });
  const [labs, setLabs] = useState<CalculatorLab[] | null>(null);
  const [choice, setChoice] = useState("");

  // Loaded once, only for a signed-in member; anyone else keeps the plain calculator.
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

  const chosen = useMemo(() => {
    if (!choice || !labs) return null;
    const [slug, chartId, index] = choice.split(":");
    const lab = labs.find((l) => l.slug === slug);
    const chart = lab?.charts.find((c) => String(c.id) === chartId);
    const lookup = chart?.snapshot.lookups[Number(index)];
    return lab && chart && lookup ? { lab, chart, lookup } : null;
  }, [choice, labs]);

  const target: Target = chosen ? LOOKUP_VESSELS[chosen.lookup.kind].solved : solveFor;
  const given = FIELDS.filter((f) => f.key !== target);
  const ready = given.every((f) => values[f.key].trim() !== "");

  const answer: LocalSolve | LabCell | null = useMemo(() => {
    if (!ready) return null;
    if (chosen) return labCell(chosen.chart.snapshot, chosen.lookup, values);
    const record: Record<string, string> = { law };
    if (law === "finet") record.ratio = ratio.trim();
    if (law === "power") record.n = n.trim();
    for (const f of given) record[f.key] = values[f.key].trim().replace(",", ".");
    return solveLocally(record);
  }, [ready, chosen, values, law, ratio, n, given]);

  const issueFor = (key: string) =>
    answer && !answer.ok ? answer.issues.find((i) => i.path[0] === key)?.text : undefined;
  const current = laws.find((l) => l.id === law);
  const inputClass = "mt-1 w-full rounded-md border border-line-strong bg-white px-3 py-2 text-lg tabular-nums";

  return (
    <div className="mt-4 flex flex-col gap-6">
      <section
        aria-live="polite"
        aria-label="Result"
        className="order-first rounded-card border-2 border-brand-700 bg-paper-raised p-4 sm:p-5"
      >
        {!ready ? (
          <p className="text-ink-soft">Enter both diameters to see the {field(target).label.toLowerCase()}.</p>
        ) : !answer ? null : !answer.ok ? (
          <div role="alert">
            <p className="font-semibold text-danger">
              {"code" in answer && answer.code === "no_solution" ? "No size" : "Check the input"}
            </p>
            <p className="mt-1">{answer.message}</p>
          </div>
        ) : "view" in answer ? (
          <div data-testid="lab-result">
            <p className="text-sm text-ink-soft">
              {lookupTitle(chosen!.lookup.kind)} · {chosen!.chart.title}
            </p>
            <p className="text-5xl font-bold tabular-nums text-brand-800" data-testid="lab-size">
              {answer.view.primary}
              {answer.view.primaryIsSize ? <span className="text-2xl font-semibold"> mm</span> : null}
              {cornerSymbols(answer.view) ? (
                <span className="ml-2 align-top text-2xl">{cornerSymbols(answer.view)}</span>
              ) : null}
            </p>
            {answer.view.pressure ? (
              <p className="text-xl font-semibold" data-testid="lab-pressure">
                {answer.view.pressure}
              </p>
            ) : null}
            {answer.exactLabel ? (
              <p className="mt-1 text-sm tabular-nums text-ink-soft">Exact by the law: {answer.exactLabel} mm</p>
            ) : null}
            {answer.view.marks.length ? (
              <ul className="mt-2 list-disc pl-5 text-sm" data-testid="lab-marks">
                {answer.view.marks.map((m) => (
                  <li key={m}>
                    <strong>
                      {MARKS[m].symbol} {MARKS[m].label}
                    </strong>
                  </li>
                ))}
              </ul>
            ) : null}
            <p className="mt-2 text-sm">{answer.view.description}</p>
            <p className="mt-2 text-xs text-ink-faint">
              From {chosen!.lab.name}&apos;s stock today and this chart&apos;s law (
              {lawName(chosen!.chart.snapshot.law)}), rounding and limits; not an approved edition.
            </p>
          </div>
        ) : (
          <div>
            <p className="text-sm text-ink-soft">{field(answer.solved).label}</p>
            <p className="text-5xl font-bold tabular-nums text-brand-800" data-testid="solve-result">
              {answer.diameterLabel} <span className="text-2xl font-semibold">mm</span>
            </p>
            <p className="mt-3 font-mono text-sm [overflow-wrap:anywhere]">{answer.formula}</p>
            {answer.warnings.length ? (
              <ul className="mt-3 list-disc pl-5 text-sm text-warn">
                {answer.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            ) : null}
          </div>
        )}
        {ready && answer?.ok ? (
          <p className="mt-3 border-t border-line pt-2 text-xs text-ink-soft">
            Reference aid only: confirm by imaging and the device&apos;s own compliance chart (full caution below).
          </p>
        ) : null}
      </section>

      {labs && labs.length ? (
        <div>
          <label htmlFor={`${id}-lab`} className="block text-sm font-medium">
            Size as a chart of my lab
          </label>
          <select id={`${id}-lab`} value={choice} onChange={(e) => setChoice(e.target.value)} className={inputClass}>
            <option value="">No lab: a published law only</option>
            {labs.map((lab) => (
              <optgroup key={lab.slug} label={lab.name}>
                {lab.charts.flatMap((c) =>
                  c.snapshot.lookups.map((l, i) => (
                    <option key={`${c.id}:${i}`} value={`${lab.slug}:${c.id}:${i}`}>
                      {c.title} · {lookupTitle(l.kind)}
                    </option>
                  )),
                )}
              </optgroup>
            ))}
          </select>
        </div>
      ) : null}

      {chosen ? null : (
        <>
          <div className="grid gap-4 sm:grid-cols-2">
            <div>
              <label htmlFor={`${id}-law`} className="block text-sm font-medium">
                Law
              </label>
              <select id={`${id}-law`} value={law} onChange={(e) => setLaw(e.target.value)} className={inputClass}>
                {laws.map((l) => (
                  <option key={l.id} value={l.id}>
                    {l.name}
                  </option>
                ))}
              </select>
            </div>
            {law === "finet" ? (
              <NumberField
                id={`${id}-ratio`}
                label={`Finet ratio (${FINET_RATIO_MIN.toFixed(2)} to ${FINET_RATIO_MAX.toFixed(2)})`}
                value={ratio}
                onChange={setRatio}
                error={issueFor("ratio")}
                className={inputClass}
              />
            ) : null}
            {law === "power" ? (
              <NumberField
                id={`${id}-n`}
                label={`Exponent n (${POWER_N_MIN.toFixed(1)} to ${POWER_N_MAX.toFixed(1)})`}
                value={n}
                onChange={setN}
                error={issueFor("n")}
                className={inputClass}
              />
            ) : null}
          </div>

          <fieldset>
            <legend className="text-sm font-medium">Solve for</legend>
            <div className="mt-2 flex flex-wrap gap-2">
              {FIELDS.map((f) => (
                <label
                  key={f.key}
                  className={`cursor-pointer rounded-md border px-3 py-2 text-sm ${solveFor === f.key ? "border-brand-700 bg-brand-50 font-semibold" : "border-line-strong bg-white"}`}
                >
                  <input
                    type="radio"
                    name={`${id}-target`}
                    value={f.key}
                    checked={solveFor === f.key}
                    onChange={() => setSolveFor(f.key)}
                    className="mr-2"
                  />
                  {f.label}
                </label>
              ))}
            </div>
          </fieldset>
        </>
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
            className={inputClass}
          />
        ))}
      </div>
      {chosen ? null : current ? <p className="text-xs text-ink-faint">Source: {current.source}</p> : null}
      {chosen ? (
        <p className="text-xs text-ink-faint">
          Law: {lawName(chosen.chart.snapshot.law)} ({Object.values(lawRecord(chosen.chart.snapshot.law)).join(", ")})
        </p>
      ) : null}
    </div>
  );
}

function NumberField(props: {
  id: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  error: string | undefined;
  className: string;
}) {
  return (
    <div>
      <label htmlFor={props.id} className="block text-sm font-medium">
        {props.label}
      </label>
      <input
        id={props.id}
        inputMode="decimal"
        autoComplete="off"
        value={props.value}
        onChange={(e) => props.onChange(e.target.value)}
        aria-invalid={Boolean(props.error)}
        aria-describedby={props.error ? `${props.id}-err` : undefined}
        className={props.className}
      />
      {props.error ? (
        <p id={`${props.id}-err`} className="mt-1 text-sm text-danger">
          {props.error}
        </p>
      ) : null}
    </div>
  );
}
