"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { formatMm } from "@/lib/stock/format";
import type { BalloonView } from "@/lib/stock/types";
import { balloonInput, type BalloonInput } from "@/lib/validation/stock";
import { FormActions } from "./family-form";
import { describedBy, FormField, inputClass, numberFromInput } from "./form-field";
import { showServerError } from "./server-errors";
import { stockRequest, stockUrl } from "./stock-api";

export function BalloonForm({
  slug,
  familyId,
  familyName,
  balloon,
  onDone,
  onCancel,
}: {
  slug: string;
  familyId: number;
  familyName: string;
  balloon?: BalloonView;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof balloonInput>, unknown, BalloonInput>({
    resolver: zodResolver(balloonInput),
    defaultValues: balloon ? { diameterMm: balloon.diameterMm, inStock: balloon.inStock } : { inStock: true },
  });

  const onSubmit = handleSubmit(async (data) => {
    try {
      if (balloon) await stockRequest("PATCH", stockUrl(slug, `/balloons/${balloon.id}`), data);
      else await stockRequest("POST", stockUrl(slug, `/families/${familyId}/balloons`), data);
      onDone(`${balloon ? "Saved" : "Added"} ${familyName} ${formatMm(data.diameterMm)} mm.`);
    } catch (err) {
      showServerError(err, setError, ["diameterMm", "inStock"]);
    }
  });

  const id = `balloon-${balloon?.id ?? `new-${familyId}`}`;
  const diameterError = errors.diameterMm?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormField
        id={`${id}-diameter`}
        label="Diameter (mm)"
        hint="1.00 to 7.00 mm in steps of 0.05 mm"
        error={diameterError}
      >
        <input
          id={`${id}-diameter`}
          inputMode="decimal"
          autoComplete="off"
          {...register("diameterMm", { setValueAs: numberFromInput })}
          className={inputClass}
          aria-invalid={!!diameterError}
          aria-describedby={describedBy(`${id}-diameter`, "hint", diameterError)}
        />
      </FormField>
      <div className="flex items-center gap-2">
        <input id={`${id}-stock`} type="checkbox" {...register("inStock")} className="h-4 w-4" />
        <label htmlFor={`${id}-stock`} className="text-sm font-medium">
          In stock
        </label>
      </div>
      <FormActions
        pending={isSubmitting}
        submitLabel={balloon ? "Save size" : "Add size"}
        onCancel={onCancel}
        error={errors.root?.server?.message}
      />
    </form>
  );
}
