"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { saveSizeAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { showActionErrors } from "@/components/ui/action-errors";
import { TextField } from "@/components/ui/field";
import { useServerAction } from "@/components/ui/use-server-action";
import { formatMm, numberFromInput } from "@/lib/stock/format";
import type { StentSizeView } from "@/lib/stock/types";
import {
  DIAMETER_MAX_MM,
  DIAMETER_MIN_MM,
  DIAMETER_STEP_MM,
  MAX_POST_DILATATION_OVER_NOMINAL_MM,
  stentSizeInput,
  type StentSizeInput,
} from "@/lib/validation/stock";
import { FormActions } from "./family-form";
import { useImpactGate } from "./impact-gate";

export const DIAMETER_HINT = `${formatMm(DIAMETER_MIN_MM)} to ${formatMm(DIAMETER_MAX_MM)} mm in steps of ${formatMm(DIAMETER_STEP_MM)} mm`;

export function SizeForm({
  slug,
  platformId,
  platformName,
  size,
  onDone,
  onCancel,
}: {
  slug: string;
  platformId: number;
  platformName: string;
  size?: StentSizeView;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const { run } = useServerAction(saveSizeAction, { refresh: false });
  const [gate, impactDialog] = useImpactGate(slug);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof stentSizeInput>, unknown, StentSizeInput>({
    resolver: zodResolver(stentSizeInput),
    defaultValues: size ? { nominalMm: size.nominalMm, maxPostDilatationMm: size.maxPostDilatationMm } : {},
  });

  const onSubmit = handleSubmit(async (data) => {
    if (size && !(await gate({ sizes: [{ id: size.id, ...data }] }, "Save size"))) return;
    const res = await run(size ? { slug, sizeId: size.id, ...data } : { slug, platformId, ...data });
    if (res.ok) onDone(`${size ? "Saved" : "Added"} ${platformName} ${formatMm(data.nominalMm)} mm.`);
    else showActionErrors(res, setError, ["nominalMm", "maxPostDilatationMm"]);
  });

  const id = `size-${size?.id ?? `new-${platformId}`}`;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {impactDialog}
      <TextField
        id={`${id}-nominal`}
        label="Nominal diameter (mm)"
        hint={DIAMETER_HINT}
        error={errors.nominalMm?.message}
        inputMode="decimal"
        autoComplete="off"
        {...register("nominalMm", { setValueAs: numberFromInput })}
      />
      <TextField
        id={`${id}-max`}
        label="Maximum post-dilatation diameter (mm)"
        hint={`from the nominal diameter up to nominal + ${formatMm(MAX_POST_DILATATION_OVER_NOMINAL_MM)} mm, as the device's instructions state`}
        error={errors.maxPostDilatationMm?.message}
        inputMode="decimal"
        autoComplete="off"
        {...register("maxPostDilatationMm", { setValueAs: numberFromInput })}
      />
      <FormActions
        pending={isSubmitting}
        submitLabel={size ? "Save size" : "Add size"}
        onCancel={onCancel}
        error={errors.root?.server?.message}
      />
    </form>
  );
}
