"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { saveBalloonAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { showActionErrors } from "@/components/ui/action-errors";
import { CheckboxField, TextField } from "@/components/ui/field";
import { useServerAction } from "@/components/ui/use-server-action";
import { formatMm, numberFromInput } from "@/lib/stock/format";
import type { BalloonView } from "@/lib/stock/types";
import { balloonInput, type BalloonInput } from "@/lib/validation/stock";
import { FormActions } from "./family-form";
import { DIAMETER_HINT } from "./size-form";

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
  const { run } = useServerAction(saveBalloonAction, { refresh: false });
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
    const res = await run(balloon ? { slug, balloonId: balloon.id, ...data } : { slug, familyId, ...data });
    if (res.ok) onDone(`${balloon ? "Saved" : "Added"} ${familyName} ${formatMm(data.diameterMm)} mm.`);
    else showActionErrors(res, setError, ["diameterMm", "inStock"]);
  });

  const id = `balloon-${balloon?.id ?? `new-${familyId}`}`;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        id={`${id}-diameter`}
        label="Diameter (mm)"
        hint={DIAMETER_HINT}
        error={errors.diameterMm?.message}
        inputMode="decimal"
        autoComplete="off"
        {...register("diameterMm", { setValueAs: numberFromInput })}
      />
      <CheckboxField id={`${id}-stock`} label="In stock" {...register("inStock")} />
      <FormActions
        pending={isSubmitting}
        submitLabel={balloon ? "Save size" : "Add size"}
        onCancel={onCancel}
        error={errors.root?.server?.message}
      />
    </form>
  );
}
