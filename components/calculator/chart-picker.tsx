import { chartOptions, type CalculatorLab } from "@/lib/calculator/choice";
import { INPUT_CLASS } from "./fields";

/** The member's labs' approved charts, each lookup named with its edition; the empty choice is a published law. */
export function ChartPicker({
  id,
  labs,
  value,
  onChange,
}: {
  id: string;
  labs: CalculatorLab[];
  value: string;
  onChange: (value: string) => void;
}) {
  return (
    <div>
      <label htmlFor={id} className="block text-base font-medium">
        Size as an approved chart of my lab
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className={INPUT_CLASS}>
        <option value="">No lab: a published law only</option>
        {labs.map((lab) => (
          <optgroup key={lab.slug} label={lab.name}>
            {chartOptions(lab).map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </optgroup>
        ))}
      </select>
    </div>
  );
}
