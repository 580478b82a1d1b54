"use client";

import { useState } from "react";
import { rulesImpactAction, saveLabRulesAction } from "@/app/(lab)/labs/[slug]/rules/actions";
import { askImpact, ImpactNotice } from "@/components/stock/impact-gate";
import { useConfirm } from "@/components/ui/dialog";
import { Button } from "@/components/ui/button";
import { FieldError, inputClass, describedBy } from "@/components/ui/field";
import { FormStatus } from "@/components/ui/form-status";
import { useServerAction } from "@/components/ui/use-server-action";
import { ALLOWED_ROUNDING } from "@/lib/charts/rules";
import { KIND_LABELS, RULE_IDS, RULE_LABELS, type LabRules, type RuleId } from "@/lib/labs/rules";
import {
  FINET_DEFAULT_RATIO,
  LAW_IDS,
  LAWS,
  POWER_N_MAX,
  POWER_N_MIN,
  type LawId,
  type LookupKind,
  type RoundingRule,
} from "@/lib/sizing";

const KINDS: LookupKind[] = ["proximal", "side", "main"];
const ROUNDING_WORDS: Record<RoundingRule, string> = {
  up: "Up to the next size",
  down: "Down to the size below",
  nearest: "To the nearest size",
  reach: "Reach by pressure (needs recorded growth)",
};

type LookupDraft = {
  laws: LawId[];
  defaultLaw: LawId;
  param: string;
  rounding: RoundingRule[];
  upMm: string;
  downMm: string;
};
type Draft = {
  reviewPeriodMonths: string;
  managersMayApprove: boolean;
  lookups: Record<LookupKind, LookupDraft>;
  exceptions: { chartId: string; rule: RuleId; reason: string }[];
};

function toDraft(r: LabRules): Draft {
  const lookups = {} as Record<LookupKind, LookupDraft>;
  for (const k of KINDS) {
    const l = r.lookups[k];
    const d = l.defaultLaw;
    lookups[k] = {
      laws: [...l.laws],
      defaultLaw: d.law,
      param: d.law === "finet" ? String(d.ratio) : d.law === "power" ? String(d.n) : "",
      rounding: [...l.rounding],
      upMm: String(l.caps.upMm),
      downMm: String(l.caps.downMm),
    };
  }
  return {
    reviewPeriodMonths: String(r.reviewPeriodMonths),
    managersMayApprove: r.managersMayApprove,
    lookups,
    exceptions: r.exceptions.map((e) => ({ chartId: String(e.chartId), rule: e.rule, reason: e.reason })),
  };
}

// A field left unreadable goes to the server as typed, so its refusal names the field.
const num = (s: string) => (s.trim() !== "" && Number.isFinite(Number(s)) ? Number(s) : s);

function toPayload(d: Draft) {
  const lookups = Object.fromEntries(
    KINDS.map((k) => {
      const l = d.lookups[k];
      const defaultLaw =
        l.defaultLaw === "finet"
          ? { law: "finet", ratio: num(l.param) }
          : l.defaultLaw === "power"
            ? { law: "power", n: num(l.param) }
            : { law: l.defaultLaw };
      return [
        k,
        { laws: l.laws, defaultLaw, rounding: l.rounding, caps: { upMm: num(l.upMm), downMm: num(l.downMm) } },
      ];
    }),
  );
  return {
    reviewPeriodMonths: num(d.reviewPeriodMonths),
    managersMayApprove: d.managersMayApprove,
    lookups,
    exceptions: d.exceptions.map((e) => ({ chartId: num(e.chartId), rule: e.rule, reason: e.reason })),
  };
}

const toggle = <T,>(list: T[], item: T, on: boolean) => (on ? [...list, item] : list.filter((x) => x !== item));

export function RulesEditor({
  slug,
  canEdit,
  rules,
  charts,
}: {
  slug: string;
  canEdit: boolean;
  rules: LabRules & { revision: number };
  charts: { id: number; title: string }[];
}) {
  const [draft, setDraft] = useState<Draft>(() => toDraft(rules));
  const [revision, setRevision] = useState(rules.revision);
  const { run, pending, state } = useServerAction(saveLabRulesAction);
  const [ask, confirmDialog] = useConfirm();
  const errors = state?.ok === false ? (state.fieldErrors ?? {}) : {};
  const err = (path: string) => errors[path];
  const chartTitle = (id: number | string) => charts.find((c) => String(c.id) === String(id))?.title ?? `Chart ${id}`;

  if (!canEdit) return <RulesReadOnly rules={rules} chartTitle={chartTitle} />;

  const setLookup = (k: LookupKind, patch: Partial<LookupDraft>) =>
    setDraft((d) => ({ ...d, lookups: { ...d.lookups, [k]: { ...d.lookups[k], ...patch } } }));

  const save = async () => {
    const payload = { slug, revision, ...toPayload(draft) };
    const outdates = await askImpact(rulesImpactAction, payload);
    if (
      outdates?.length &&
      (await ask({
        title: "Posted copies will go out of date",
        body: <ImpactNotice outdates={outdates} />,
        confirm: "Save the rules",
        danger: true,
      })) === false
    )
      return;
    const res = await run(payload);
    const next = (res.data as { revision?: number } | undefined)?.revision;
    if (res.ok && next !== undefined) setRevision(next);
  };

  return (
    <form
      className="space-y-6"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
      aria-describedby="rules-status"
    >
      <section aria-labelledby="general-h" className="rounded-md border border-line p-4">
        <h2 id="general-h" className="text-lg font-semibold">
          Review and approval
        </h2>
        <div className="mt-3 grid gap-4 sm:grid-cols-2">
          <div>
            <label htmlFor="review-period" className="block text-sm font-medium">
              Review period (months)
            </label>
            <input
              id="review-period"
              type="number"
              min={1}
              max={60}
              step={1}
              inputMode="numeric"
              className={inputClass}
              value={draft.reviewPeriodMonths}
              aria-invalid={err("reviewPeriodMonths") ? true : undefined}
              aria-describedby={describedBy("review-period", true, err("reviewPeriodMonths"))}
              onChange={(e) => setDraft((d) => ({ ...d, reviewPeriodMonths: e.target.value }))}
            />
            <p id="review-period-hint" className="mt-1 text-xs text-ink-faint">
              An approved edition is due for review this many months after approval (1 to 60).
            </p>
            <FieldError id="review-period-error" error={err("reviewPeriodMonths")} />
          </div>
          <div className="flex items-start gap-2 pt-6">
            <input
              id="managers-approve"
              type="checkbox"
              className="mt-1 size-4"
              checked={draft.managersMayApprove}
              onChange={(e) => setDraft((d) => ({ ...d, managersMayApprove: e.target.checked }))}
            />
            <label htmlFor="managers-approve" className="text-sm">
              Managers may approve editions too (the medical lead always may)
            </label>
          </div>
        </div>
      </section>

      {KINDS.map((k) => {
        const l = draft.lookups[k];
        const p = `lookups.${k}`;
        return (
          <section key={k} aria-labelledby={`${k}-h`} className="rounded-md border border-line p-4">
            <h2 id={`${k}-h`} className="text-lg font-semibold">
              {KIND_LABELS[k]}
            </h2>
            <div className="mt-3 grid gap-4 lg:grid-cols-2">
              <fieldset aria-describedby={err(`${p}.laws`) ? `${k}-laws-error` : undefined}>
                <legend className="text-sm font-medium">Laws allowed</legend>
                <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
                  {LAW_IDS.map((law) => (
                    <label key={law} className="flex items-center gap-2 text-sm">
                      <input
                        type="checkbox"
                        className="size-4"
                        checked={l.laws.includes(law)}
                        onChange={(e) => setLookup(k, { laws: toggle(l.laws, law, e.target.checked) })}
                      />
                      {LAWS[law].name}
                    </label>
                  ))}
                </div>
                <FieldError id={`${k}-laws-error`} error={err(`${p}.laws`) ?? err(`${p}.laws.0`)} />
              </fieldset>
              <div className="grid gap-3 sm:grid-cols-2">
                <div>
                  <label htmlFor={`${k}-default-law`} className="block text-sm font-medium">
                    Default law for new charts
                  </label>
                  <select
                    id={`${k}-default-law`}
                    className={inputClass}
                    value={l.defaultLaw}
                    aria-invalid={err(`${p}.defaultLaw`) ? true : undefined}
                    aria-describedby={describedBy(`${k}-default-law`, false, err(`${p}.defaultLaw`))}
                    onChange={(e) => {
                      const law = e.target.value as LawId;
                      setLookup(k, {
                        defaultLaw: law,
                        param: law === "finet" ? String(FINET_DEFAULT_RATIO) : law === "power" ? "2.5" : "",
                      });
                    }}
                  >
                    {LAW_IDS.map((law) => (
                      <option key={law} value={law}>
                        {LAWS[law].name}
                      </option>
                    ))}
                  </select>
                  <FieldError id={`${k}-default-law-error`} error={err(`${p}.defaultLaw`)} />
                </div>
                {l.defaultLaw === "finet" || l.defaultLaw === "power" ? (
                  <div>
                    <label htmlFor={`${k}-param`} className="block text-sm font-medium">
                      {l.defaultLaw === "finet" ? "Finet ratio" : `Exponent n (${POWER_N_MIN} to ${POWER_N_MAX})`}
                    </label>
                    <input
                      id={`${k}-param`}
                      type="number"
                      step="0.001"
                      inputMode="decimal"
                      className={inputClass}
                      value={l.param}
                      aria-invalid={err(`${p}.defaultLaw.ratio`) || err(`${p}.defaultLaw.n`) ? true : undefined}
                      onChange={(e) => setLookup(k, { param: e.target.value })}
                    />
                    <FieldError
                      id={`${k}-param-error`}
                      error={err(`${p}.defaultLaw.ratio`) ?? err(`${p}.defaultLaw.n`)}
                    />
                  </div>
                ) : null}
              </div>
              <fieldset>
                <legend className="text-sm font-medium">Rounding rules allowed</legend>
                <div className="mt-1 flex flex-col gap-1">
                  {ALLOWED_ROUNDING[k].map((r) => (
                    <label key={r} className="flex items-center gap-2 text-sm">
                      <input
                        type="checkbox"
                        className="size-4"
                        checked={l.rounding.includes(r)}
                        onChange={(e) => setLookup(k, { rounding: toggle(l.rounding, r, e.target.checked) })}
                      />
                      {ROUNDING_WORDS[r]}
                    </label>
                  ))}
                </div>
                <FieldError id={`${k}-rounding-error`} error={err(`${p}.rounding`)} />
              </fieldset>
              <fieldset className="grid gap-3 sm:grid-cols-2">
                <legend className="text-sm font-medium">Largest rounding caps (mm from the exact target)</legend>
                {(["upMm", "downMm"] as const).map((side) => (
                  <div key={side}>
                    <label htmlFor={`${k}-${side}`} className="block text-sm">
                      {side === "upMm" ? "Above the target" : "Below the target"}
                    </label>
                    <input
                      id={`${k}-${side}`}
                      type="number"
                      min={0}
                      max={1}
                      step="0.05"
                      inputMode="decimal"
                      className={inputClass}
                      value={l[side]}
                      aria-invalid={err(`${p}.caps.${side}`) ? true : undefined}
                      aria-describedby={describedBy(`${k}-${side}`, false, err(`${p}.caps.${side}`))}
                      onChange={(e) => setLookup(k, { [side]: e.target.value })}
                    />
                    <FieldError id={`${k}-${side}-error`} error={err(`${p}.caps.${side}`)} />
                  </div>
                ))}
              </fieldset>
            </div>
          </section>
        );
      })}

      <section aria-labelledby="exceptions-h" className="rounded-md border border-line p-4">
        <h2 id="exceptions-h" className="text-lg font-semibold">
          Exceptions for single charts
        </h2>
        <p className="mt-1 text-sm text-ink-soft">
          An exception lets one chart be approved although it breaks a rule. Give the reason: the poster prints it. A
          legibility exception excuses the reading distance only: figures too small to read even at arm&apos;s length
          (40&nbsp;cm) are still refused.
        </p>
        {draft.exceptions.length === 0 ? <p className="mt-2 text-sm">No exceptions recorded.</p> : null}
        <ul className="mt-3 space-y-4">
          {draft.exceptions.map((e, i) => {
            const set = (patch: Partial<Draft["exceptions"][number]>) =>
              setDraft((d) => ({
                ...d,
                exceptions: d.exceptions.map((x, j) => (j === i ? { ...x, ...patch } : x)),
              }));
            return (
              <li key={i} className="grid gap-3 rounded-md bg-paper-sunk p-3 md:grid-cols-[1fr_1fr_2fr_auto]">
                <div>
                  <label htmlFor={`ex-${i}-chart`} className="block text-sm font-medium">
                    Chart
                  </label>
                  <select
                    id={`ex-${i}-chart`}
                    className={inputClass}
                    value={e.chartId}
                    onChange={(ev) => set({ chartId: ev.target.value })}
                  >
                    {charts.map((c) => (
                      <option key={c.id} value={c.id}>
                        {c.title}
                      </option>
                    ))}
                  </select>
                  <FieldError id={`ex-${i}-chart-error`} error={err(`exceptions.${i}.chartId`)} />
                </div>
                <div>
                  <label htmlFor={`ex-${i}-rule`} className="block text-sm font-medium">
                    Rule
                  </label>
                  <select
                    id={`ex-${i}-rule`}
                    className={inputClass}
                    value={e.rule}
                    onChange={(ev) => set({ rule: ev.target.value as RuleId })}
                  >
                    {RULE_IDS.map((r) => (
                      <option key={r} value={r}>
                        {RULE_LABELS[r]}
                      </option>
                    ))}
                  </select>
                  <FieldError id={`ex-${i}-rule-error`} error={err(`exceptions.${i}.rule`)} />
                </div>
                <div>
                  <label htmlFor={`ex-${i}-reason`} className="block text-sm font-medium">
                    Reason (printed on the poster)
                  </label>
                  <input
                    id={`ex-${i}-reason`}
                    className={inputClass}
                    value={e.reason}
                    maxLength={300}
                    aria-invalid={err(`exceptions.${i}.reason`) ? true : undefined}
                    aria-describedby={describedBy(`ex-${i}-reason`, false, err(`exceptions.${i}.reason`))}
                    onChange={(ev) => set({ reason: ev.target.value })}
                  />
                  <FieldError id={`ex-${i}-reason-error`} error={err(`exceptions.${i}.reason`)} />
                </div>
                <div className="flex items-end">
                  <Button
                    type="button"
                    variant="secondary"
                    aria-label={`Remove the exception for ${chartTitle(e.chartId)}`}
                    onClick={() => setDraft((d) => ({ ...d, exceptions: d.exceptions.filter((_, j) => j !== i) }))}
                  >
                    Remove
                  </Button>
                </div>
              </li>
            );
          })}
        </ul>
        {charts.length ? (
          <Button
            type="button"
            variant="secondary"
            className="mt-3"
            onClick={() =>
              setDraft((d) => ({
                ...d,
                exceptions: [...d.exceptions, { chartId: String(charts[0]!.id), rule: "law", reason: "" }],
              }))
            }
          >
            Add an exception
          </Button>
        ) : (
          <p className="mt-2 text-sm text-ink-soft">The lab has no charts yet.</p>
        )}
      </section>

      {confirmDialog}
      <div id="rules-status" className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Save the rules"}
        </Button>
        <FormStatus ok={state?.ok} message={state?.message} />
      </div>
    </form>
  );
}

function RulesReadOnly({ rules, chartTitle }: { rules: LabRules; chartTitle: (id: number) => string }) {
  const lawWords = (d: LabRules["lookups"]["proximal"]["defaultLaw"]) =>
    `${LAWS[d.law].name}${d.law === "finet" ? ` (ratio ${d.ratio})` : d.law === "power" ? ` (n = ${d.n})` : ""}`;
  return (
    <div className="space-y-6">
      <section aria-labelledby="general-h" className="rounded-md border border-line p-4">
        <h2 id="general-h" className="text-lg font-semibold">
          Review and approval
        </h2>
        <dl className="mt-2 grid gap-x-4 gap-y-1 sm:grid-cols-[auto_1fr]">
          <dt className="font-medium">Review period</dt>
          <dd>{rules.reviewPeriodMonths} months after approval</dd>
          <dt className="font-medium">Who may approve</dt>
          <dd>{rules.managersMayApprove ? "The medical lead and managers" : "The medical lead"}</dd>
        </dl>
      </section>
      {KINDS.map((k) => {
        const l = rules.lookups[k];
        return (
          <section key={k} aria-labelledby={`${k}-h`} className="rounded-md border border-line p-4">
            <h2 id={`${k}-h`} className="text-lg font-semibold">
              {KIND_LABELS[k]}
            </h2>
            <dl className="mt-2 grid gap-x-4 gap-y-1 sm:grid-cols-[auto_1fr]">
              <dt className="font-medium">Laws allowed</dt>
              <dd>{l.laws.map((x) => LAWS[x].name).join(", ")}</dd>
              <dt className="font-medium">Default law</dt>
              <dd>{lawWords(l.defaultLaw)}</dd>
              <dt className="font-medium">Rounding allowed</dt>
              <dd>{l.rounding.map((r) => ROUNDING_WORDS[r]).join("; ")}</dd>
              <dt className="font-medium">Largest caps</dt>
              <dd>
                {l.caps.upMm} mm above, {l.caps.downMm} mm below the exact target
              </dd>
            </dl>
          </section>
        );
      })}
      <section aria-labelledby="exceptions-h" className="rounded-md border border-line p-4">
        <h2 id="exceptions-h" className="text-lg font-semibold">
          Exceptions for single charts
        </h2>
        {rules.exceptions.length === 0 ? (
          <p className="mt-2">No exceptions recorded.</p>
        ) : (
          <ul className="mt-2 list-disc space-y-1 pl-5">
            {rules.exceptions.map((e) => (
              <li key={`${e.chartId}:${e.rule}`}>
                <span className="font-medium">{chartTitle(e.chartId)}</span> — {RULE_LABELS[e.rule]}: {e.reason}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
