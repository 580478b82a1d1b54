"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { savePlatformAction } from "@/app/(lab)/labs/[slug]/stock/actions";
import { showActionErrors } from "@/components/ui/action-errors";
import { TextField } from "@/components/ui/field";
import { useServerAction } from "@/components/ui/use-server-action";
import type { StentPlatformView } from "@/lib/stock/types";
import { stentPlatformInput, type StentPlatformInput } from "@/lib/validation/stock";
import { FormActions } from "./family-form";

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
  const { run } = useServerAction(savePlatformAction, { refresh: false });
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
    const res = await run({ slug, platformId: platform?.id, ...data });
    if (res.ok) onDone(res.message ?? "Saved.");
    else showActionErrors(res, setError, ["name"]);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        id={`platform-${platform?.id ?? "new"}-name`}
        label="Name"
        error={errors.name?.message}
        autoComplete="off"
        {...register("name")}
      />
      <FormActions
        pending={isSubmitting}
        submitLabel={platform ? "Save platform" : "Add platform"}
        onCancel={onCancel}
        error={errors.root?.server?.message}
      />
    </form>
  );
}
