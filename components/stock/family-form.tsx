"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import type { BalloonFamilyView } from "@/lib/stock/types";
import { balloonFamilyInput, COMPLIANCE_LABELS, COMPLIANCES, type BalloonFamilyInput } from "@/lib/validation/stock";
import { describedBy, FormField, inputClass, numberFromInput } from "./form-field";
import { showServerError } from "./server-errors";
import { stockRequest, stockUrl } from "./stock-api";

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
    const body = { ...data, growthAtRbpMm: data.growthAtRbpMm ?? null };
    try {
      if (family) await stockRequest("PATCH", stockUrl(slug, `/families/${family.id}`), body);
      else await stockRequest("POST", stockUrl(slug, "/families"), body);
      onDone(family ? `Saved ${data.name}.` : `Added balloon family ${data.name}.`);
    } catch (err) {
      showServerError(err, setError, FIELDS);
    }
  });

  const id = (f: string) => `family-${family?.id ?? "new"}-${f}`;
  const err = (f: (typeof FIELDS)[number]) => errors[f]?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormField id={id("name")} label="Name" error={err("name")}>
        <input
          id={id("name")}
          {...register("name")}
          className={inputClass}
          autoComplete="off"
          aria-invalid={!!err("name")}
          aria-describedby={describedBy(id("name"), undefined, err("name"))}
        />
      </FormField>
      <FormField id={id("compliance")} label="Compliance" error={err("compliance")}>
        <select
          id={id("compliance")}
          {...register("compliance")}
          className={inputClass}
          aria-invalid={!!err("compliance")}
        >
          {COMPLIANCES.map((c) => (
            <option key={c} value={c}>
              {COMPLIANCE_LABELS[c]}
            </option>
          ))}
        </select>
      </FormField>
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField id={id("nominal")} label="Nominal pressure (atm)" hint="1 to 40 atm" error={err("nominalAtm")}>
          <input
            id={id("nominal")}
            inputMode="decimal"
            {...register("nominalAtm", { setValueAs: numberFromInput })}
            className={inputClass}
            aria-invalid={!!err("nominalAtm")}
            aria-describedby={describedBy(id("nominal"), "hint", err("nominalAtm"))}
          />
        </FormField>
        <FormField
          id={id("rbp")}
          label="Rated burst pressure (atm)"
          hint="above the nominal pressure"
          error={err("rbpAtm")}
        >
          <input
            id={id("rbp")}
            inputMode="decimal"
            {...register("rbpAtm", { setValueAs: numberFromInput })}
            className={inputClass}
            aria-invalid={!!err("rbpAtm")}
            aria-describedby={describedBy(id("rbp"), "hint", err("rbpAtm"))}
          />
        </FormField>
      </div>
      <FormField
        id={id("growth")}
        label="Growth at rated burst pressure (mm, optional)"
        hint="0 to 1.00 mm over the nominal diameter; leave empty if not recorded"
        error={err("growthAtRbpMm")}
      >
        <input
          id={id("growth")}
          inputMode="decimal"
          {...register("growthAtRbpMm", {
            setValueAs: (v) => (String(v ?? "").trim() === "" ? null : numberFromInput(v)),
          })}
          className={inputClass}
          aria-invalid={!!err("growthAtRbpMm")}
          aria-describedby={describedBy(id("growth"), "hint", err("growthAtRbpMm"))}
        />
      </FormField>
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
