"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { useFieldArray, useForm, useWatch, type FieldErrors } from "react-hook-form";
import { saveChartAction } from "@/app/(lab)/labs/[slug]/charts/actions";
import { useServerAction } from "@/components/ui/use-server-action";
import { CardSidesField, type CardIssue } from "@/components/charts/card-sides-field";
import { ChartPreview } from "@/components/charts/chart-preview";
import { RuleBreaches } from "@/components/charts/rule-breaches";
import { Button } from "@/components/ui/button";
import { FieldError } from "@/components/ui/field";
import { cardAfterRemovingLookup } from "@/lib/charts/card-choice";
import { defaultLookup } from "@/lib/charts/defaults";
import type { LabStock } from "@/lib/charts/snapshot";
import type { LabRules } from "@/lib/labs/rules";
import { ORIENTATIONS, PAPER_IDS, PAPERS } from "@/lib/poster/paper";
import {
  FINET_DEFAULT_RATIO,
  FINET_RATIO_MAX,
  FINET_RATIO_MIN,
  LAW_IDS,
  LAWS,
  POWER_N_MAX,
  POWER_N_MIN,
  type LookupKind,
} from "@/lib/sizing";
import { chartDefinitionSchema, LOOKUP_KINDS, ROUNDING_RULES, type ChartDefinition } from "@/lib/validation/chart";

const KIND_LABELS: Record<LookupKind, string> = {
  proximal: "Proximal (POT balloon from main × side branch)",
  side: "Side branch (kissing balloon from parent × main branch)",
  main: "Main branch (balloon from parent × side branch)",
};
const RULE_LABELS = {
  up: "Up (larger size)",
  down: "Down (smaller size)",
  nearest: "Nearest size",
  reach: "Reach by pressure",
} as const;

const field = "mt-1 w-full rounded-md border border-line-strong bg-white px-3 py-2 disabled:bg-paper-sunk";
const label = "block text-sm font-medium";

function errorAt(errors: FieldErrors<ChartDefinition>, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[key];
  return (node as { message?: string } | undefined)?.message;
}

/** Every message at or under `path` in the form's errors (the schema's on submit, or the server's). */
function errorsUnder(node: unknown, path: string, out: CardIssue[] = []): CardIssue[] {
  if (!node || typeof node !== "object") return out;
  const { message, ...rest } = node as Record<string, unknown>;
  if (typeof message === "string" && message) out.push({ path, message });
  for (const [key, child] of Object.entries(rest))
    if (key !== "ref" && key !== "type" && key !== "types") errorsUnder(child, `${path}.${key}`, out);
  return out;
}

export function ChartDesigner({
  slug,
  chartId,
  initial,
  stock,
  labName,
  logoSha256 = null,
  canEdit,
  labRules,
}: {
  slug: string;
  chartId: number | null;
  initial: ChartDefinition;
  stock: LabStock;
  labName: string;
  logoSha256?: string | null;
  canEdit: boolean;
  labRules?: LabRules;
}) {
  const router = useRouter();
  const { run: save, pending } = useServerAction(saveChartAction, { refresh: false });
  const [notice, setNotice] = useState<{ ok: boolean; text: string } | null>(null);
  const form = useForm<ChartDefinition>({
    resolver: zodResolver(chartDefinitionSchema) as never,
    defaultValues: initial,
    mode: "onChange",
  });
  const { register, control, handleSubmit, formState, setError, setValue } = form;
  const lookups = useFieldArray({ control, name: "lookups" });
  const values = useWatch({ control }) as ChartDefinition;
  const law = values.law?.law;
  const usedKinds = new Set((values.lookups ?? []).map((l) => l.kind));
  const families = stock.balloonFamilies;

  const preview = useMemo(() => chartDefinitionSchema.safeParse(values), [values]);
  // The card's problems as the form stands now, and any left from the last save.
  const cardIssues = useMemo(() => {
    const live: CardIssue[] = preview.success
      ? []
      : preview.error.issues
          .filter((i) => i.path[0] === "card")
          .map((i) => ({ path: i.path.join("."), message: i.message }));
    const seen = new Set(live.map((i) => i.message));
    return [...live, ...errorsUnder(formState.errors.card, "card").filter((i) => !seen.has(i.message))];
  }, [preview, formState.errors.card]);

  const onSubmit = handleSubmit(async (def) => {
    setNotice(null);
    const res = await save({ slug, chartId, definition: def });
    if (!res.ok) {
      for (const [path, message] of Object.entries(res.fieldErrors ?? {})) setError(path as never, { message });
      setNotice({ ok: false, text: res.message ?? "The chart was not saved." });
      return;
    }
    setNotice({ ok: true, text: res.message ?? "Saved." });
    if (chartId === null && res.id) router.push(`/labs/${slug}/charts/${res.id}`);
    else router.refresh();
  });

  const num = { valueAsNumber: true } as const;
  return (
    <div className="grid gap-8 xl:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <form onSubmit={onSubmit} noValidate aria-label="Chart design" className="space-y-6">
        <fieldset disabled={!canEdit || pending} className="space-y-5">
          <div>
            <label htmlFor="title" className={label}>
              Title
            </label>
            <input
              id="title"
              {...register("title")}
              className={field}
              aria-invalid={Boolean(errorAt(formState.errors, "title"))}
              aria-describedby="title-err"
            />
            <FieldError id="title-err" error={errorAt(formState.errors, "title")} />
          </div>

          <div className="grid grid-cols-2 gap-3">
            <div>
              <label htmlFor="law" className={label}>
                Law
              </label>
              <select
                id="law"
                className={field}
                value={law}
                onChange={(e) => {
                  const id = e.target.value as ChartDefinition["law"]["law"];
                  setValue(
                    "law",
                    id === "finet"
                      ? { law: id, ratio: FINET_DEFAULT_RATIO }
                      : id === "power"
                        ? { law: id, n: 2.3 }
                        : { law: id },
                    { shouldValidate: true },
                  );
                }}
              >
                {LAW_IDS.map((id) => (
                  <option key={id} value={id}>
                    {LAWS[id].name}
                  </option>
                ))}
              </select>
            </div>
            {law === "finet" ? (
              <div>
                <label htmlFor="ratio" className={label}>
                  Ratio ({FINET_RATIO_MIN.toFixed(2)}–{FINET_RATIO_MAX.toFixed(2)})
                </label>
                <input id="ratio" type="number" step="0.001" {...register("law.ratio", num)} className={field} />
                <FieldError id="ratio-err" error={errorAt(formState.errors, "law.ratio")} />
              </div>
            ) : null}
            {law === "power" ? (
              <div>
                <label htmlFor="n" className={label}>
                  Exponent n ({POWER_N_MIN.toFixed(1)}–{POWER_N_MAX.toFixed(1)})
                </label>
                <input id="n" type="number" step="0.01" {...register("law.n", num)} className={field} />
                <FieldError id="n-err" error={errorAt(formState.errors, "law.n")} />
              </div>
            ) : null}
          </div>

          {lookups.fields.map((f, i) => (
            <fieldset key={f.id} className="rounded-card border border-line bg-paper-raised p-4">
              <legend className="px-1 text-sm font-semibold">Lookup {i + 1}</legend>
              <div className="space-y-3">
                <div>
                  <label htmlFor={`kind-${i}`} className={label}>
                    Kind
                  </label>
                  <select id={`kind-${i}`} {...register(`lookups.${i}.kind`)} className={field}>
                    {LOOKUP_KINDS.map((k) => (
                      <option key={k} value={k} disabled={k !== values.lookups?.[i]?.kind && usedKinds.has(k)}>
                        {KIND_LABELS[k]}
                      </option>
                    ))}
                  </select>
                  <FieldError id={`kind-${i}-err`} error={errorAt(formState.errors, `lookups.${i}.kind`)} />
                </div>
                <div className="grid grid-cols-2 gap-3">
                  <div>
                    <label htmlFor={`family-${i}`} className={label}>
                      Balloon family
                    </label>
                    <select id={`family-${i}`} {...register(`lookups.${i}.familyId`, num)} className={field}>
                      {families.length === 0 ? <option value={0}>No balloon families in stock</option> : null}
                      {families.map((fam) => (
                        <option key={fam.id} value={fam.id}>
                          {fam.name}
                        </option>
                      ))}
                    </select>
                    <FieldError id={`family-${i}-err`} error={errorAt(formState.errors, `lookups.${i}.familyId`)} />
                  </div>
                  <div>
                    <label htmlFor={`rounding-${i}`} className={label}>
                      Rounding to stock
                    </label>
                    <select id={`rounding-${i}`} {...register(`lookups.${i}.rounding`)} className={field}>
                      {ROUNDING_RULES.map((r) => (
                        <option key={r} value={r}>
                          {RULE_LABELS[r]}
                        </option>
                      ))}
                    </select>
                  </div>
                </div>
                {(["rows", "cols"] as const).map((axis) => (
                  <div key={axis}>
                    <p className={label}>{axis === "rows" ? "Rows" : "Columns"} (mm): from, to, step</p>
                    <div className="mt-1 grid grid-cols-3 gap-2">
                      {(["from", "to", "step"] as const).map((part) => (
                        <input
                          key={part}
                          aria-label={`Lookup ${i + 1} ${axis === "rows" ? "rows" : "columns"} ${part}`}
                          type="number"
                          step="0.05"
                          {...register(`lookups.${i}.${axis}.${part}` as `lookups.${number}.rows.from`, num)}
                          className={field}
                        />
                      ))}
                    </div>
                    <FieldError id={`${axis}-${i}-err`} error={errorAt(formState.errors, `lookups.${i}.${axis}`)} />
                  </div>
                ))}
                {lookups.fields.length > 1 ? (
                  <Button
                    type="button"
                    variant="ghost"
                    onClick={() => {
                      lookups.remove(i);
                      // The card's sides name lookups by place: keep them on the same lookups.
                      if (values.card) setValue("card", cardAfterRemovingLookup(values.card, i), { shouldDirty: true });
                    }}
                  >
                    Remove lookup {i + 1}
                  </Button>
                ) : null}
              </div>
            </fieldset>
          ))}
          {lookups.fields.length < 3 ? (
            <Button
              type="button"
              variant="secondary"
              onClick={() => {
                const kind = LOOKUP_KINDS.find((k) => !usedKinds.has(k))!;
                lookups.append(defaultLookup(kind, families[0]) as ChartDefinition["lookups"][number]);
              }}
            >
              Add a lookup
            </Button>
          ) : null}
          <FieldError id="lookups-err" error={errorAt(formState.errors, "lookups")} />

          <div>
            <label htmlFor="stent" className={label}>
              Stent platform for hazard marks (POT above its maximum post-dilatation)
            </label>
            <select
              id="stent"
              className={field}
              value={values.stentPlatformId ?? ""}
              onChange={(e) =>
                setValue("stentPlatformId", e.target.value ? Number(e.target.value) : null, { shouldValidate: true })
              }
            >
              <option value="">None</option>
              {stock.stentPlatforms.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </select>
          </div>

          <div className="grid grid-cols-3 gap-3">
            <div>
              <label htmlFor="paper" className={label}>
                Paper
              </label>
              <select id="paper" {...register("paper")} className={field}>
                {PAPER_IDS.map((p) => (
                  <option key={p} value={p}>
                    {PAPERS[p].label}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor="orientation" className={label}>
                Orientation
              </label>
              <select id="orientation" {...register("orientation")} className={field}>
                {ORIENTATIONS.map((o) => (
                  <option key={o} value={o}>
                    {o}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor="distance" className={label}>
                Reading distance (m)
              </label>
              <input id="distance" type="number" step="0.1" {...register("readingDistanceM", num)} className={field} />
              <FieldError id="distance-err" error={errorAt(formState.errors, "readingDistanceM")} />
            </div>
            <div>
              <label htmlFor="cap-up" className={label}>
                Rounding cap above (mm)
              </label>
              <input id="cap-up" type="number" step="0.05" {...register("roundingCaps.upMm", num)} className={field} />
              <FieldError id="cap-up-err" error={errorAt(formState.errors, "roundingCaps.upMm")} />
            </div>
            <div>
              <label htmlFor="cap-down" className={label}>
                Rounding cap below (mm)
              </label>
              <input
                id="cap-down"
                type="number"
                step="0.05"
                {...register("roundingCaps.downMm", num)}
                className={field}
              />
              <FieldError id="cap-down-err" error={errorAt(formState.errors, "roundingCaps.downMm")} />
            </div>
          </div>
          <p className="text-xs text-ink-soft">
            A printed balloon further from the exact diameter than a cap is marked ↑ or ↓ (defaults 0.25 mm above, 0.5
            mm below: common practice, no published source).
          </p>

          <div>
            <label htmlFor="notes" className={label}>
              Notes printed on the poster
            </label>
            <textarea id="notes" rows={3} {...register("notes")} className={field} />
            <FieldError id="notes-err" error={errorAt(formState.errors, "notes")} />
          </div>

          <CardSidesField
            lookups={values.lookups ?? []}
            card={values.card}
            issues={cardIssues}
            onChange={(card) => setValue("card", card, { shouldDirty: true, shouldValidate: true })}
          />
        </fieldset>

        {notice ? (
          <p
            role={notice.ok ? "status" : "alert"}
            className={`rounded-md border px-3 py-2 text-sm ${notice.ok ? "border-ok/40 bg-ok-soft" : "border-danger/40 bg-danger-soft text-danger"}`}
          >
            {notice.text}
          </p>
        ) : null}
        {canEdit ? (
          <Button type="submit" disabled={pending}>
            {pending ? "Saving…" : chartId === null ? "Create chart" : "Save chart"}
          </Button>
        ) : (
          <p className="text-sm text-ink-faint">Read only: educators and managers design charts.</p>
        )}
      </form>

      <section aria-label="Live preview" className="min-w-0">
        <h2 className="text-lg font-semibold">Live preview</h2>
        {preview.success && labRules ? <RuleBreaches {...{ chartId, labRules }} definition={preview.data} /> : null}
        {preview.success ? (
          <ChartPreview {...{ stock, labName, logoSha256, labRules, chartId }} definition={preview.data} />
        ) : (
          <p className="mt-2 rounded-md border border-line bg-paper-sunk p-4 text-ink-soft">
            Correct the highlighted fields to see the preview.
          </p>
        )}
      </section>
    </div>
  );
}
