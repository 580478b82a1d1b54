"use client";

import type { UseFormReturn } from "react-hook-form";
import { FieldError } from "@/components/ui/field";
import { errorAt } from "@/lib/charts/designer-form";
import type { LabStock } from "@/lib/charts/snapshot";
import { ORIENTATIONS, PAPER_IDS, PAPERS } from "@/lib/poster/paper";
import type { ChartDefinition } from "@/lib/validation/chart";
import { fieldClass, labelClass, num } from "./styles";

/** The stent platform for hazard marks. */
export function StentField({
  form,
  platforms,
  value,
}: {
  form: UseFormReturn<ChartDefinition>;
  platforms: LabStock["stentPlatforms"];
  value: number | null | undefined;
}) {
  return (
    <div>
      <label htmlFor="stent" className={labelClass}>
        Stent platform for hazard marks (POT above its maximum post-dilatation)
      </label>
      <select
        id="stent"
        className={fieldClass}
        value={value ?? ""}
        onChange={(e) =>
          form.setValue("stentPlatformId", e.target.value ? Number(e.target.value) : null, { shouldValidate: true })
        }
      >
        <option value="">None</option>
        {platforms.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </select>
    </div>
  );
}

/** Paper, orientation, reading distance, rounding caps and the poster's notes. */
export function PrintFields({ form }: { form: UseFormReturn<ChartDefinition> }) {
  const { register, formState } = form;
  const err = (path: string) => errorAt(formState.errors, path);
  return (
    <>
      <div className="grid grid-cols-3 gap-3">
        <div>
          <label htmlFor="paper" className={labelClass}>
            Paper
          </label>
          <select id="paper" {...register("paper")} className={fieldClass}>
            {PAPER_IDS.map((p) => (
              <option key={p} value={p}>
                {PAPERS[p].label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="orientation" className={labelClass}>
            Orientation
          </label>
          <select id="orientation" {...register("orientation")} className={fieldClass}>
            {ORIENTATIONS.map((o) => (
              <option key={o} value={o}>
                {o}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="distance" className={labelClass}>
            Reading distance (m)
          </label>
          <input id="distance" type="number" step="0.1" {...register("readingDistanceM", num)} className={fieldClass} />
          <FieldError id="distance-err" error={err("readingDistanceM")} />
        </div>
        <div>
          <label htmlFor="cap-up" className={labelClass}>
            Rounding cap above (mm)
          </label>
          <input id="cap-up" type="number" step="0.05" {...register("roundingCaps.upMm", num)} className={fieldClass} />
          <FieldError id="cap-up-err" error={err("roundingCaps.upMm")} />
        </div>
        <div>
          <label htmlFor="cap-down" className={labelClass}>
            Rounding cap below (mm)
          </label>
          <input
            id="cap-down"
            type="number"
            step="0.05"
            {...register("roundingCaps.downMm", num)}
            className={fieldClass}
          />
          <FieldError id="cap-down-err" error={err("roundingCaps.downMm")} />
        </div>
      </div>
      <p className="text-xs text-ink-soft">
        A printed balloon further from the exact diameter than a cap is marked ↑ or ↓ (defaults 0.25 mm above, 0.5 mm
        below: common practice, no published source).
      </p>

      <div>
        <label htmlFor="notes" className={labelClass}>
          Notes printed on the poster
        </label>
        <textarea id="notes" rows={3} {...register("notes")} className={fieldClass} />
        <FieldError id="notes-err" error={err("notes")} />
      </div>
    </>
  );
}
