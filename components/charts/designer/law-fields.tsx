"use client";

import type { UseFormReturn } from "react-hook-form";
import { FieldError } from "@/components/ui/field";
import { errorAt, lawChoice } from "@/lib/charts/designer-form";
import { FINET_RATIO_MAX, FINET_RATIO_MIN, LAW_IDS, LAWS, POWER_N_MAX, POWER_N_MIN } from "@/lib/sizing";
import type { ChartDefinition } from "@/lib/validation/chart";
import { fieldClass, labelClass, num } from "./styles";

/** The sizing law and, for Finet and the power law, its parameter. */
export function LawFields({
  form,
  law,
}: {
  form: UseFormReturn<ChartDefinition>;
  law: ChartDefinition["law"]["law"] | undefined;
}) {
  const { register, setValue, formState } = form;
  return (
    <div className="grid grid-cols-2 gap-3">
      <div>
        <label htmlFor="law" className={labelClass}>
          Law
        </label>
        <select
          id="law"
          className={fieldClass}
          value={law}
          onChange={(e) =>
            setValue("law", lawChoice(e.target.value as ChartDefinition["law"]["law"]), { shouldValidate: true })
          }
        >
          {LAW_IDS.map((id) => (
            <option key={id} value={id}>
              {LAWS[id].name}
            </option>
          ))}
        </select>
      </div>
      {law === "finet" ? (
        <div>
          <label htmlFor="ratio" className={labelClass}>
            Ratio ({FINET_RATIO_MIN.toFixed(2)}–{FINET_RATIO_MAX.toFixed(2)})
          </label>
          <input id="ratio" type="number" step="0.001" {...register("law.ratio", num)} className={fieldClass} />
          <FieldError id="ratio-err" error={errorAt(formState.errors, "law.ratio")} />
        </div>
      ) : null}
      {law === "power" ? (
        <div>
          <label htmlFor="n" className={labelClass}>
            Exponent n ({POWER_N_MIN.toFixed(1)}–{POWER_N_MAX.toFixed(1)})
          </label>
          <input id="n" type="number" step="0.01" {...register("law.n", num)} className={fieldClass} />
          <FieldError id="n-err" error={errorAt(formState.errors, "law.n")} />
        </div>
      ) : null}
    </div>
  );
}
