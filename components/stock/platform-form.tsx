"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import type { StentPlatformView } from "@/lib/stock/types";
import { stentPlatformInput, type StentPlatformInput } from "@/lib/validation/stock";
import { FormActions } from "./family-form";
import { describedBy, FormField, inputClass } from "./form-field";
import { showServerError } from "./server-errors";
import { stockRequest, stockUrl } from "./stock-api";

export function PlatformForm({
  slug,
  platform,
  onDone,
  onCancel,
}: {
  slug: string;
  platform?: StentPlatformView;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof stentPlatformInput>, unknown, StentPlatformInput>({
    resolver: zodResolver(stentPlatformInput),
    defaultValues: { name: platform?.name ?? "" },
  });

  const onSubmit = handleSubmit(async (data) => {
    try {
      if (platform) await stockRequest("PATCH", stockUrl(slug, `/platforms/${platform.id}`), data);
      else await stockRequest("POST", stockUrl(slug, "/platforms"), data);
      onDone(platform ? `Renamed to ${data.name}.` : `Added stent platform ${data.name}.`);
    } catch (err) {
      showServerError(err, setError, ["name"]);
    }
  });

  const id = `platform-${platform?.id ?? "new"}-name`;
  const error = errors.name?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormField id={id} label="Name" error={error}>
        <input
          id={id}
          {...register("name")}
          autoComplete="off"
          className={inputClass}
          aria-invalid={!!error}
          aria-describedby={describedBy(id, undefined, error)}
        />
      </FormField>
      <FormActions
        pending={isSubmitting}
        submitLabel={platform ? "Save platform" : "Add platform"}
        onCancel={onCancel}
        error={errors.root?.server?.message}
      />
    </form>
  );
}
