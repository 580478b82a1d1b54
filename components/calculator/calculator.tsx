"use client";

import { useId, useState } from "react";
import useSWR from "swr";
import { formatDecimal } from "@/lib/sizing/format";
import { FINET_RATIO_MAX, FINET_RATIO_MIN, POWER_N_MAX, POWER_N_MIN } from "@/lib/sizing";

type LawOption = { id: string; name: string; formula: string; source: string };
type Target = "parent" | "mb" | "sb";
type SolveOk = {
  law: string;
  solved: Target;
  diameterMm: number;
  diameterLabel: string;
  formula: string;
  warnings: string[];
};
type SolveError = {
  error: { code: string; message: string; issues?: { path: (string | number)[]; message: string }[] };
};

const FIELDS: { key: Target; label: string; hint: string }[] = [
  { key: "parent", label: "Parent (proximal main vessel)", hint: "Dp" },
  { key: "mb", label: "Main branch", hint: "Dmb" },
  { key: "sb", label: "Side branch", hint: "Dsb" },
];

class SolveFailure extends Error {
  constructor(readonly body: SolveError) {
    super(body.error.message);
  }
}

async function fetchSolve(url: string): Promise<SolveOk> {
  const res = await fetch(url);
  const body = await res.json();
  if (!res.ok) throw new SolveFailure(body as SolveError);
  return body as SolveOk;
}

export function Calculator({ laws }: { laws: LawOption[] }) {
  const id = useId();
  const [law, setLaw] = useState("finet");
  const [ratio, setRatio] = useState("0.678");
  const [n, setN] = useState("2.3");
  const [solveFor, setSolveFor] = useState<Target>("parent");
  const [values, setValues] = useState<Record<Target, string>>({ parent: "", mb: "3.5", sb: "2.5" });

  const given = FIELDS.filter((f) => f.key !== solveFor);
  const ready = given.every((f) => values[f.key].trim() !== "");
  const params = new URLSearchParams({ law });
  if (law === "finet") params.set("ratio", ratio.trim());
  if (law === "power") params.set("n", n.trim());
  for (const f of given) params.set(f.key, values[f.key].trim().replace(",", "."));
  const { data, error, isLoading } = useSWR<SolveOk, SolveFailure>(
    ready ? `/api/v1/solve?${params}` : null,
    fetchSolve,
    {
      keepPreviousData: false,
      shouldRetryOnError: false,
    },
  );

  const fieldError = (key: string) => error?.body.error.issues?.find((i) => i.path[0] === key)?.message;
  const current = laws.find((l) => l.id === law);
  const inputClass = "mt-1 w-full rounded-md border border-line-strong bg-white px-3 py-2 text-lg tabular-nums";

  return (
    <div className="mt-6 space-y-6">
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
          <div>
            <label htmlFor={`${id}-ratio`} className="block text-sm font-medium">
              Finet ratio ({FINET_RATIO_MIN.toFixed(2)} to {FINET_RATIO_MAX.toFixed(2)})
            </label>
            <input
              id={`${id}-ratio`}
              inputMode="decimal"
              value={ratio}
              onChange={(e) => setRatio(e.target.value)}
              aria-invalid={Boolean(fieldError("ratio"))}
              className={inputClass}
            />
            {fieldError("ratio") ? <p className="mt-1 text-sm text-danger">{fieldError("ratio")}</p> : null}
          </div>
        ) : null}
        {law === "power" ? (
          <div>
            <label htmlFor={`${id}-n`} className="block text-sm font-medium">
              Exponent n ({POWER_N_MIN.toFixed(1)} to {POWER_N_MAX.toFixed(1)})
            </label>
            <input
              id={`${id}-n`}
              inputMode="decimal"
              value={n}
              onChange={(e) => setN(e.target.value)}
              aria-invalid={Boolean(fieldError("n"))}
              className={inputClass}
            />
            {fieldError("n") ? <p className="mt-1 text-sm text-danger">{fieldError("n")}</p> : null}
          </div>
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

      <div className="grid gap-4 sm:grid-cols-2">
        {given.map((f) => (
          <div key={f.key}>
            <label htmlFor={`${id}-${f.key}`} className="block text-sm font-medium">
              {f.label} ({f.hint}), mm
            </label>
            <input
              id={`${id}-${f.key}`}
              inputMode="decimal"
              autoComplete="off"
              value={values[f.key]}
              onChange={(e) => setValues((v) => ({ ...v, [f.key]: e.target.value }))}
              aria-invalid={Boolean(fieldError(f.key))}
              aria-describedby={fieldError(f.key) ? `${id}-${f.key}-err` : undefined}
              className={inputClass}
            />
            {fieldError(f.key) ? (
              <p id={`${id}-${f.key}-err`} className="mt-1 text-sm text-danger">
                {fieldError(f.key)}
              </p>
            ) : null}
          </div>
        ))}
      </div>

      <section aria-live="polite" aria-label="Result" className="rounded-card border border-line bg-paper-raised p-5">
        {!ready ? (
          <p className="text-ink-soft">
            Enter both diameters to see the {FIELDS.find((f) => f.key === solveFor)!.label.toLowerCase()}.
          </p>
        ) : isLoading ? (
          <p className="text-ink-soft">Calculating…</p>
        ) : error ? (
          <div role="alert">
            <p className="font-semibold text-danger">
              {error.body.error.code === "no_solution" ? "No size" : "Check the input"}
            </p>
            <p className="mt-1">{error.message}</p>
          </div>
        ) : data ? (
          <div>
            <p className="text-sm text-ink-soft">{FIELDS.find((f) => f.key === data.solved)!.label}</p>
            <p
              className="text-5xl font-bold tabular-nums text-brand-800"
              title={`${data.diameterMm} mm (exact)`}
              data-testid="solve-result"
            >
              {data.diameterLabel} <span className="text-2xl font-semibold">mm</span>
            </p>
            <p className="mt-1 text-sm tabular-nums text-ink-faint">Exact: {formatDecimal(data.diameterMm, 4)} mm</p>
            <p className="mt-3 font-mono text-sm">{data.formula}</p>
            {data.warnings.length ? (
              <ul className="mt-3 list-disc pl-5 text-sm text-warn">
                {data.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : null}
      </section>
      {current ? <p className="text-xs text-ink-faint">Source: {current.source}</p> : null}
    </div>
  );
}
