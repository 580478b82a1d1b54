"use client";

import { Button } from "@/components/ui/button";
import { FieldError, SelectField } from "@/components/ui/field";
import {
  axisSentence,
  capacitySentence,
  planCardSide,
  shownCardSides,
  type CardAxisPlan,
} from "@/lib/charts/card-choice";
import { formatAxisMm } from "@/lib/poster/marks";
import { LOOKUP_VESSELS, VESSEL_LABELS, type LookupKind } from "@/lib/sizing";
import type { CardChoice, CardSide, ChartDefinition } from "@/lib/validation/chart";

// Short enough for a 320 px wide select.
const KIND_SHORT: Record<LookupKind, string> = {
  proximal: "POT (proximal)",
  side: "side branch",
  main: "main branch",
};

export type CardIssue = { path: string; message: string };

/**
 * The designer's "Badge card" section: for each side a lookup and optional row and column
 * ranges over that lookup's axis values (first to last: the whole axis), with what fits legibly.
 */
export function CardSidesField({
  lookups,
  card,
  issues,
  onChange,
}: {
  lookups: ChartDefinition["lookups"];
  card: CardChoice | null | undefined;
  /** Problems with paths under `card` (from the schema or the server), each shown at its side. */
  issues: CardIssue[];
  onChange: (card: CardChoice | null) => void;
}) {
  const sides = shownCardSides(card, lookups.length);
  const setSide = (s: 0 | 1, side: CardSide) =>
    onChange({ sides: s === 0 ? [side, sides[1]] : [sides[0], side] } as CardChoice);
  const general = issues.filter((i) => !/^card\.sides\.[01]\b/.test(i.path));
  return (
    <fieldset className="min-w-0 rounded-card border border-line bg-paper-raised p-4">
      <legend className="px-1 text-sm font-semibold">Badge card</legend>
      <p id="card-help" className="text-xs text-ink-soft">
        The pocket card (85.60 × 53.98 mm) prints one lookup per side, read at 40 cm. Choose the lookup for each side
        and, if you like, the rows and columns your team reaches for; first to last value is the whole axis.
      </p>
      {card ? (
        <Button type="button" variant="ghost" className="mt-2 px-2" onClick={() => onChange(null)}>
          Back to the default sides
        </Button>
      ) : (
        <p className="mt-2 text-xs text-ink-soft">
          Default: lookup 1 on side 1; lookup 2 on side 2, or with one lookup the key (legend, caution, dates, QR code).
        </p>
      )}
      {general.map((i) => (
        <FieldError key={i.path + i.message} id="card-err" error={i.message} />
      ))}
      <div className="mt-3 space-y-4">
        {([0, 1] as const).map((s) => (
          <SideFields
            key={s}
            s={s}
            side={sides[s]}
            lookups={lookups}
            issues={issues.filter((i) => i.path === `card.sides.${s}` || i.path.startsWith(`card.sides.${s}.`))}
            onChange={(side) => setSide(s, side)}
          />
        ))}
      </div>
    </fieldset>
  );
}

function SideFields({
  s,
  side,
  lookups,
  issues,
  onChange,
}: {
  s: 0 | 1;
  side: CardSide;
  lookups: ChartDefinition["lookups"];
  issues: CardIssue[];
  onChange: (side: CardSide) => void;
}) {
  const id = `card-${s}`;
  const lookup = lookups[side.lookup];
  const plan = lookup ? planCardSide(lookup, side) : null;
  const at = (suffix: string) =>
    issues
      .filter((i) => i.path.replace(`card.sides.${s}`, "").startsWith(suffix))
      .map((i) => i.message)
      .join(" ") || undefined;
  return (
    <fieldset className="min-w-0 border-t border-line pt-3">
      <legend className="text-sm font-semibold">Side {s + 1}</legend>
      <SelectField
        id={`${id}-lookup`}
        label="Lookup"
        value={String(side.lookup)}
        onChange={(e) => onChange({ lookup: Number(e.target.value) })}
        error={at(".lookup")}
        options={[
          ...lookups.map((l, i) => ({ value: String(i), label: `Lookup ${i + 1}: ${KIND_SHORT[l.kind]}` })),
          ...(lookup
            ? []
            : [{ value: String(side.lookup), label: `Lookup ${side.lookup + 1} (no longer on the chart)` }]),
        ]}
      />
      {lookup && plan ? (
        <div>
          <p aria-live="polite" className="mt-2 text-sm">
            {capacitySentence(plan)}
          </p>
          {(["rows", "cols"] as const).map((axis) => (
            <AxisRange
              key={axis}
              id={`${id}-${axis}`}
              which={axis === "rows" ? "rows" : "columns"}
              vessel={VESSEL_LABELS[LOOKUP_VESSELS[lookup.kind][axis]]}
              plan={plan[axis]}
              range={side[axis]}
              error={at(`.${axis}`)}
              onChange={(range) => {
                const next: CardSide = { ...side };
                if (range) next[axis] = range;
                else delete next[axis];
                onChange(next);
              }}
            />
          ))}
        </div>
      ) : lookup ? (
        <p className="mt-2 text-sm text-ink-soft">
          Correct lookup {side.lookup + 1}&apos;s rows and columns to choose what this side prints.
        </p>
      ) : null}
    </fieldset>
  );
}

function AxisRange({
  id,
  which,
  vessel,
  plan,
  range,
  error,
  onChange,
}: {
  id: string;
  which: "rows" | "columns";
  vessel: string;
  plan: CardAxisPlan;
  range: [number, number] | undefined;
  error: string | undefined;
  onChange: (range: [number, number] | undefined) => void;
}) {
  const axis = plan.axis;
  const first = axis[0] as number;
  const last = axis[axis.length - 1] as number;
  const from = range?.[0] ?? first;
  const to = range?.[1] ?? last;
  const options = (current: number) => [
    ...axis.map((v) => ({ value: String(v), label: formatAxisMm(v) })),
    // A value the axis no longer has stays visible, with the schema's message below.
    ...(axis.includes(current)
      ? []
      : [{ value: String(current), label: `${formatAxisMm(current)} (not on the axis)` }]),
  ];
  const set = (f: number, t: number) => onChange(f === first && t === last ? undefined : [f, t]);
  const Which = which === "rows" ? "Rows" : "Columns";
  const note = `${id}-note`;
  const describedBy = error ? `${id}-error` : note;
  return (
    <div role="group" aria-labelledby={`${id}-title`} className="mt-3">
      <p id={`${id}-title`} className="text-sm font-medium">
        {Which}: {vessel}
        {range ? "" : " (whole axis)"}
      </p>
      <div className="grid grid-cols-2 gap-2">
        <SelectField
          id={`${id}-from`}
          label={`${Which} from`}
          value={String(from)}
          aria-describedby={describedBy}
          aria-invalid={error ? true : undefined}
          onChange={(e) => set(Number(e.target.value), to)}
          options={options(from)}
        />
        <SelectField
          id={`${id}-to`}
          label={`${Which} to`}
          value={String(to)}
          aria-describedby={describedBy}
          aria-invalid={error ? true : undefined}
          onChange={(e) => set(from, Number(e.target.value))}
          options={options(to)}
        />
      </div>
      {/* With a problem, the message below says it; a sentence about an empty range would only repeat it. */}
      <p
        hidden={Boolean(error)}
        id={note}
        aria-live="polite"
        className={`mt-1 text-sm ${plan.printed.length < plan.chosen.length ? "rounded-md bg-warn-soft px-2 py-1 font-medium text-warn" : "text-ink-soft"}`}
      >
        {axisSentence(plan, which)}
      </p>
      <FieldError id={`${id}-error`} error={error} />
    </div>
  );
}
