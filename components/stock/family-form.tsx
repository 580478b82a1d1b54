"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { saveFamilyAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { showActionErrors } from "@/components/ui/action-errors";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { useServerAction } from "@/components/ui/use-server-action";
import { formatMm, numberFromInput } from "@/lib/stock/format";
import type { BalloonFamilyView } from "@/lib/stock/types";
import {
  balloonFamilyInput,
  COMPLIANCE_LABELS,
  COMPLIANCES,
  GROWTH_MAX_MM,
  PRESSURE_MAX_ATM,
  PRESSURE_MIN_ATM,
  type BalloonFamilyInput,
} from "@/lib/validation/stock";

const FIELDS = ["name", "compliance", "nominalAtm", "rbpAtm", "growthAtRbpMm"] as const;

export function FamilyForm({
  slug,
  family,
  onDone,
  onCancel,
}: {
  slug: string;
  family?: BalloonFamilyView;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const { run } = useServerAction(saveFamilyAction, { refresh: false });
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof balloonFamilyInput>, unknown, BalloonFamilyInput>({
    resolver: zodResolver(balloonFamilyInput),
    defaultValues: family
      ? {
          name: family.name,
          compliance: family.compliance,
          nominalAtm: family.nominalAtm,
          rbpAtm: family.rbpAtm,
          growthAtRbpMm: family.growthAtRbpMm,
        }
      : { compliance: "nc", growthAtRbpMm: null },
  });

  const onSubmit = handleSubmit(async (data) => {
    const res = await run({ slug, familyId: family?.id, ...data, growthAtRbpMm: data.growthAtRbpMm ?? null });
    if (res.ok) onDone(res.message ?? "Saved.");
    else showActionErrors(res, setError, FIELDS);
  });

  const id = (f: string) => `family-${family?.id ?? "new"}-${f}`;
  const err = (f: (typeof FIELDS)[number]) => errors[f]?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField id={id("name")} label="Name" error={err("name")} autoComplete="off" {...register("name")} />
      <SelectField
        id={id("compliance")}
        label="Compliance"
        error={err("compliance")}
        options={COMPLIANCES.map((c) => ({ value: c, label: COMPLIANCE_LABELS[c] }))}
        {...register("compliance")}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          id={id("nominal")}
          label="Nominal pressure (atm)"
          hint={`${PRESSURE_MIN_ATM} to ${PRESSURE_MAX_ATM} atm`}
          error={err("nominalAtm")}
          inputMode="decimal"
          {...register("nominalAtm", { setValueAs: numberFromInput })}
        />
        <TextField
          id={id("rbp")}
          label="Rated burst pressure (atm)"
          hint="above the nominal pressure"
          error={err("rbpAtm")}
          inputMode="decimal"
          {...register("rbpAtm", { setValueAs: numberFromInput })}
        />
      </div>
      <TextField
        id={id("growth")}
        label="Growth at rated burst pressure (mm, optional)"
        hint={`0 to ${formatMm(GROWTH_MAX_MM)} mm over the nominal diameter; leave empty if not recorded`}
        error={err("growthAtRbpMm")}
        inputMode="decimal"
        {...register("growthAtRbpMm", {
          setValueAs: (v) => (String(v ?? "").trim() === "" ? null : numberFromInput(v)),
        })}
      />
      <FormActions
        pending={isSubmitting}
        submitLabel={family ? "Save family" : "Add family"}
        onCancel={onCancel}
        error={errors.root?.server?.message}
      />
    </form>
  );
}

export function FormActions({
  pending,
  submitLabel,
  onCancel,
  error,
}: {
  pending: boolean;
  submitLabel: string;
  onCancel: () => void;
  error?: string;
}) {
  return (
    <>
      {error ? (
        <p role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-3 py-2 text-sm text-danger">
          {error}
        </p>
      ) : null}
      <div className="flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={pending} aria-busy={pending}>
          {pending ? "Saving…" : submitLabel}
        </Button>
      </div>
    </>
  );
}
