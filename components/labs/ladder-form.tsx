"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { createLadderFamilyAction } from "@/app/(lab)/labs/[slug]/stock/ladder/actions";
import { showActionErrors } from "@/components/ui/action-errors";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { useServerAction } from "@/components/ui/use-server-action";
import { SIZE_LADDER } from "@/lib/labs/first-run";
import { formatMm, numberFromInput } from "@/lib/stock/format";
import { ladderFamilySchema, type LadderFamilyInput } from "@/lib/validation/ladder";
import {
  COMPLIANCE_LABELS,
  COMPLIANCES,
  GROWTH_MAX_MM,
  PRESSURE_MAX_ATM,
  PRESSURE_MIN_ATM,
} from "@/lib/validation/stock";

const FIELDS = ["name", "compliance", "nominalAtm", "rbpAtm", "growthAtRbpMm", "diameters"] as const;

export function LadderForm({ slug }: { slug: string }) {
  const router = useRouter();
  const { run } = useServerAction(createLadderFamilyAction, { refresh: false });
  const {
    register,
    handleSubmit,
    setError,
    control,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof ladderFamilySchema>, unknown, LadderFamilyInput>({
    resolver: zodResolver(ladderFamilySchema),
    // No pressures here on purpose: they come from the device's compliance chart.
    defaultValues: { compliance: "nc", growthAtRbpMm: null, diameters: [...SIZE_LADDER] },
  });
  const ticked = new Set(useWatch({ control, name: "diameters" }) ?? []);
  const toggle = (d: number) =>
    setValue(
      "diameters",
      SIZE_LADDER.filter((x) => (x === d ? !ticked.has(d) : ticked.has(x))),
      { shouldValidate: false },
    );

  const onSubmit = handleSubmit(async (data) => {
    const res = await run({ slug, ...data });
    if (res.ok) router.push(`/labs/${slug}`);
    else showActionErrors(res, setError, FIELDS);
  });
  const err = (f: (typeof FIELDS)[number]) => errors[f]?.message;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label="Balloon family from the size ladder"
      className="max-w-2xl space-y-4"
    >
      <TextField
        id="ladder-name"
        label="Family name"
        error={err("name")}
        autoComplete="off"
        hint="As your shelf labels it."
        {...register("name")}
      />
      <SelectField
        id="ladder-compliance"
        label="Compliance"
        error={err("compliance")}
        options={COMPLIANCES.map((c) => ({ value: c, label: COMPLIANCE_LABELS[c] }))}
        {...register("compliance")}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          id="ladder-nominal"
          label="Nominal pressure (atm)"
          hint={`From the device's compliance chart; ${PRESSURE_MIN_ATM} to ${PRESSURE_MAX_ATM} atm`}
          error={err("nominalAtm")}
          inputMode="decimal"
          {...register("nominalAtm", { setValueAs: numberFromInput })}
        />
        <TextField
          id="ladder-rbp"
          label="Rated burst pressure (atm)"
          hint="From the device's compliance chart; above the nominal pressure"
          error={err("rbpAtm")}
          inputMode="decimal"
          {...register("rbpAtm", { setValueAs: numberFromInput })}
        />
      </div>
      <TextField
        id="ladder-growth"
        label="Growth at rated burst pressure (mm, optional)"
        hint={`0 to ${formatMm(GROWTH_MAX_MM)} mm; leave empty if the compliance chart does not give it (charts then check stent limits at the nominal diameter and say so)`}
        error={err("growthAtRbpMm")}
        inputMode="decimal"
        {...register("growthAtRbpMm", {
          setValueAs: (v) => (String(v ?? "").trim() === "" ? null : numberFromInput(v)),
        })}
      />
      <fieldset aria-describedby={err("diameters") ? "ladder-diameters-error" : undefined}>
        <legend className="text-sm font-medium">Diameters you stock (mm): untick the ones you do not</legend>
        <div className="mt-2 grid grid-cols-4 gap-2 sm:grid-cols-8">
          {SIZE_LADDER.map((d) => (
            <label key={d} className="flex items-center gap-1 text-sm tabular-nums">
              <input type="checkbox" checked={ticked.has(d)} onChange={() => toggle(d)} />
              {formatMm(d)}
            </label>
          ))}
        </div>
        {err("diameters") ? (
          <p id="ladder-diameters-error" className="mt-1 text-sm text-danger">
            {err("diameters")}
          </p>
        ) : null}
      </fieldset>
      {errors.root?.server?.message ? (
        <p role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-3 py-2 text-sm text-danger">
          {errors.root.server.message}
        </p>
      ) : null}
      <Button type="submit" disabled={isSubmitting} aria-busy={isSubmitting}>
        {isSubmitting ? "Adding…" : "Add this family to the stock"}
      </Button>
    </form>
  );
}
