"use client";

import type { UseFormReturn } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { FieldError } from "@/components/ui/field";
import { errorAt } from "@/lib/charts/designer-form";
import type { LabStock } from "@/lib/charts/snapshot";
import type { LookupKind } from "@/lib/sizing";
import { LOOKUP_KINDS, ROUNDING_RULES, type ChartDefinition } from "@/lib/validation/chart";
import { fieldClass, labelClass, num } from "./styles";

const KIND_LABELS: Record<LookupKind, string> = {
  proximal: "Proximal (POT balloon from main × side branch)",
  side: "Side branch (kissing balloon from parent × main branch)",
  main: "Main branch (balloon from parent × side branch)",
};
const RULE_LABELS = {
  up: "Up (larger size)",
  down: "Down (smaller size)",
  nearest: "Nearest size",
  reach: "Reach by pressure",
} as const;

/** One lookup: its kind, balloon family, rounding rule and the two axes. */
export function LookupFieldset({
  form,
  index: i,
  kind,
  usedKinds,
  families,
  onRemove,
}: {
  form: UseFormReturn<ChartDefinition>;
  index: number;
  kind: LookupKind | undefined;
  usedKinds: ReadonlySet<LookupKind>;
  families: LabStock["balloonFamilies"];
  /** Absent when this is the only lookup (a chart keeps at least one). */
  onRemove?: () => void;
}) {
  const { register, formState } = form;
  return (
    <fieldset className="rounded-card border border-line bg-paper-raised p-4">
      <legend className="px-1 text-sm font-semibold">Lookup {i + 1}</legend>
      <div className="space-y-3">
        <div>
          <label htmlFor={`kind-${i}`} className={labelClass}>
            Kind
          </label>
          <select id={`kind-${i}`} {...register(`lookups.${i}.kind`)} className={fieldClass}>
            {LOOKUP_KINDS.map((k) => (
              <option key={k} value={k} disabled={k !== kind && usedKinds.has(k)}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </select>
          <FieldError id={`kind-${i}-err`} error={errorAt(formState.errors, `lookups.${i}.kind`)} />
        </div>
        <div className="grid grid-cols-2 gap-3">
          <div>
            <label htmlFor={`family-${i}`} className={labelClass}>
              Balloon family
            </label>
            <select id={`family-${i}`} {...register(`lookups.${i}.familyId`, num)} className={fieldClass}>
              {families.length === 0 ? <option value={0}>No balloon families in stock</option> : null}
              {families.map((fam) => (
                <option key={fam.id} value={fam.id}>
                  {fam.name}
                </option>
              ))}
            </select>
            <FieldError id={`family-${i}-err`} error={errorAt(formState.errors, `lookups.${i}.familyId`)} />
          </div>
          <div>
            <label htmlFor={`rounding-${i}`} className={labelClass}>
              Rounding to stock
            </label>
            <select id={`rounding-${i}`} {...register(`lookups.${i}.rounding`)} className={fieldClass}>
              {ROUNDING_RULES.map((r) => (
                <option key={r} value={r}>
                  {RULE_LABELS[r]}
                </option>
              ))}
            </select>
          </div>
        </div>
        {(["rows", "cols"] as const).map((axis) => (
          <div key={axis}>
            <p className={labelClass}>{axis === "rows" ? "Rows" : "Columns"} (mm): from, to, step</p>
            <div className="mt-1 grid grid-cols-3 gap-2">
              {(["from", "to", "step"] as const).map((part) => (
                <input
                  key={part}
                  aria-label={`Lookup ${i + 1} ${axis === "rows" ? "rows" : "columns"} ${part}`}
                  type="number"
                  step="0.05"
                  {...register(`lookups.${i}.${axis}.${part}` as `lookups.${number}.rows.from`, num)}
                  className={fieldClass}
                />
              ))}
            </div>
            <FieldError id={`${axis}-${i}-err`} error={errorAt(formState.errors, `lookups.${i}.${axis}`)} />
          </div>
        ))}
        {onRemove ? (
          <Button type="button" variant="ghost" onClick={onRemove}>
            Remove lookup {i + 1}
          </Button>
        ) : null}
      </div>
    </fieldset>
  );
}
