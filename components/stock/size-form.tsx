"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { formatMm } from "@/lib/stock/format";
import type { StentSizeView } from "@/lib/stock/types";
import { stentSizeInput, type StentSizeInput } from "@/lib/validation/stock";
import { FormActions } from "./family-form";
import { describedBy, FormField, inputClass, numberFromInput } from "./form-field";
import { showServerError } from "./server-errors";
import { stockRequest, stockUrl } from "./stock-api";

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
    try {
      if (size) await stockRequest("PATCH", stockUrl(slug, `/sizes/${size.id}`), data);
      else await stockRequest("POST", stockUrl(slug, `/platforms/${platformId}/sizes`), data);
      onDone(`${size ? "Saved" : "Added"} ${platformName} ${formatMm(data.nominalMm)} mm.`);
    } catch (err) {
      showServerError(err, setError, ["nominalMm", "maxPostDilatationMm"]);
    }
  });

  const id = `size-${size?.id ?? `new-${platformId}`}`;
  const nominalError = errors.nominalMm?.message;
  const maxError = errors.maxPostDilatationMm?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormField
        id={`${id}-nominal`}
        label="Nominal diameter (mm)"
        hint="1.00 to 7.00 mm in steps of 0.05 mm"
        error={nominalError}
      >
        <input
          id={`${id}-nominal`}
          inputMode="decimal"
          autoComplete="off"
          {...register("nominalMm", { setValueAs: numberFromInput })}
          className={inputClass}
          aria-invalid={!!nominalError}
          aria-describedby={describedBy(`${id}-nominal`, "hint", nominalError)}
        />
      </FormField>
      <FormField
        id={`${id}-max`}
        label="Maximum post-dilatation diameter (mm)"
        hint="from the nominal diameter up to nominal + 2.00 mm, as the device's instructions state"
        error={maxError}
      >
        <input
          id={`${id}-max`}
          inputMode="decimal"
          autoComplete="off"
          {...register("maxPostDilatationMm", { setValueAs: numberFromInput })}
          className={inputClass}
          aria-invalid={!!maxError}
          aria-describedby={describedBy(`${id}-max`, "hint", maxError)}
        />
      </FormField>
      <FormActions
        pending={isSubmitting}
        submitLabel={size ? "Save size" : "Add size"}
        onCancel={onCancel}
        error={errors.root?.server?.message}
      />
    </form>
  );
}
