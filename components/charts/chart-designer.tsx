"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { saveChartAction } from "@/app/(lab)/labs/[slug]/charts/actions";
import { useServerAction } from "@/components/ui/use-server-action";
import { CardSidesField } from "@/components/charts/card-sides-field";
import { ChartPreview } from "@/components/charts/chart-preview";
import { HazardShareWarning } from "@/components/charts/hazard-share-warning";
import { LawFields } from "@/components/charts/designer/law-fields";
import { LookupFieldset } from "@/components/charts/designer/lookup-fieldset";
import { PrintFields, StentField } from "@/components/charts/designer/print-fields";
import { SaveNotice } from "@/components/charts/designer/save-notice";
import { fieldClass, labelClass } from "@/components/charts/designer/styles";
import { RuleBreaches } from "@/components/charts/rule-breaches";
import { Button } from "@/components/ui/button";
import { FieldError } from "@/components/ui/field";
import { cardAfterRemovingLookup } from "@/lib/charts/card-choice";
import { defaultLookup } from "@/lib/charts/defaults";
import { errorAt, mergeCardIssues, nextLookupKind } from "@/lib/charts/designer-form";
import type { LabStock } from "@/lib/charts/snapshot";
import type { LabRules } from "@/lib/labs/rules";
import { chartDefinitionSchema, type ChartDefinition } from "@/lib/validation/chart";

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
  const usedKinds = new Set((values.lookups ?? []).map((l) => l.kind));
  const families = stock.balloonFamilies;

  const preview = useMemo(() => chartDefinitionSchema.safeParse(values), [values]);
  const cardIssues = useMemo(
    () => mergeCardIssues(preview.success ? [] : preview.error.issues, formState.errors.card),
    [preview, formState.errors.card],
  );

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

  const removeLookup = (i: number) => {
    lookups.remove(i);
    // The card's sides name lookups by place: keep them on the same lookups.
    if (values.card) setValue("card", cardAfterRemovingLookup(values.card, i), { shouldDirty: true });
  };
  const nextKind = lookups.fields.length < 3 ? nextLookupKind(usedKinds) : null;

  return (
    <div className="grid gap-8 xl:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <form onSubmit={onSubmit} noValidate aria-label="Chart design" className="space-y-6">
        <fieldset disabled={!canEdit || pending} className="space-y-5">
          <div>
            <label htmlFor="title" className={labelClass}>
              Title
            </label>
            <input
              id="title"
              {...register("title")}
              className={fieldClass}
              aria-invalid={Boolean(errorAt(formState.errors, "title"))}
              aria-describedby="title-err"
            />
            <FieldError id="title-err" error={errorAt(formState.errors, "title")} />
          </div>

          <LawFields form={form} law={values.law?.law} />

          {lookups.fields.map((f, i) => (
            <LookupFieldset
              key={f.id}
              form={form}
              index={i}
              kind={values.lookups?.[i]?.kind}
              usedKinds={usedKinds}
              families={families}
              onRemove={lookups.fields.length > 1 ? () => removeLookup(i) : undefined}
            />
          ))}
          {nextKind ? (
            <Button
              type="button"
              variant="secondary"
              onClick={() => lookups.append(defaultLookup(nextKind, families[0]) as ChartDefinition["lookups"][number])}
            >
              Add a lookup
            </Button>
          ) : null}
          <FieldError id="lookups-err" error={errorAt(formState.errors, "lookups")} />

          <StentField form={form} platforms={stock.stentPlatforms} value={values.stentPlatformId} />
          <PrintFields form={form} />

          <CardSidesField
            lookups={values.lookups ?? []}
            card={values.card}
            issues={cardIssues}
            onChange={(card) => setValue("card", card, { shouldDirty: true, shouldValidate: true })}
          />
        </fieldset>

        <SaveNotice notice={notice} />
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
        {preview.success ? <HazardShareWarning definition={preview.data} stock={stock} /> : null}
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
