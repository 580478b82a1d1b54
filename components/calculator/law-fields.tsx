import { FINET_RATIO_MAX, FINET_RATIO_MIN, POWER_N_MAX, POWER_N_MIN } from "@/lib/sizing";
import { FIELDS, INPUT_CLASS, type LawOption, type Target } from "./fields";
import { NumberField } from "./number-field";

export type LawState = { law: string; ratio: string; n: string; solveFor: Target };

/** The published law, its parameter and which diameter to solve for (when no lab chart is chosen). */
export function LawFields({
  id,
  laws,
  state,
  onChange,
  issueFor,
}: {
  id: string;
  laws: LawOption[];
  state: LawState;
  onChange: (next: Partial<LawState>) => void;
  issueFor: (key: string) => string | undefined;
}) {
  return (
    <>
      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor={`${id}-law`} className="block text-base font-medium">
            Law
          </label>
          <select
            id={`${id}-law`}
            value={state.law}
            onChange={(e) => onChange({ law: e.target.value })}
            className={INPUT_CLASS}
          >
            {laws.map((l) => (
              <option key={l.id} value={l.id}>
                {l.name}
              </option>
            ))}
          </select>
        </div>
        {state.law === "finet" ? (
          <NumberField
            id={`${id}-ratio`}
            label={`Finet ratio (${FINET_RATIO_MIN.toFixed(2)} to ${FINET_RATIO_MAX.toFixed(2)})`}
            value={state.ratio}
            onChange={(ratio) => onChange({ ratio })}
            error={issueFor("ratio")}
            className={INPUT_CLASS}
          />
        ) : null}
        {state.law === "power" ? (
          <NumberField
            id={`${id}-n`}
            label={`Exponent n (${POWER_N_MIN.toFixed(1)} to ${POWER_N_MAX.toFixed(1)})`}
            value={state.n}
            onChange={(n) => onChange({ n })}
            error={issueFor("n")}
            className={INPUT_CLASS}
          />
        ) : null}
      </div>
      <fieldset>
        <legend className="text-base font-medium">Solve for</legend>
        <div className="mt-2 flex flex-wrap gap-2">
          {FIELDS.map((f) => (
            <label
              key={f.key}
              className={`inline-flex min-h-11 cursor-pointer items-center rounded-md border px-3 text-base ${state.solveFor === f.key ? "border-brand-700 bg-brand-50 font-semibold" : "border-line-strong bg-white"}`}
            >
              <input
                type="radio"
                name={`${id}-target`}
                value={f.key}
                checked={state.solveFor === f.key}
                onChange={() => onChange({ solveFor: f.key })}
                className="mr-2 h-5 w-5"
              />
              {f.label}
            </label>
          ))}
        </div>
      </fieldset>
    </>
  );
}
