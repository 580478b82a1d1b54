"use client";

import { Button } from "@/components/ui/button";
import { formatAtm, formatMm } from "@/lib/stock/format";
import { FIELD_LABELS, formatStockValue } from "@/lib/stock/history";
import { isEmptyPlan, type ImportResult } from "@/lib/stock/import-plan";
import type { ReactNode } from "react";
import { count } from "@/lib/format/plural";

export function ImportPreview({
  result,
  fileName,
  onApply,
  onCancel,
  impact,
}: {
  result: ImportResult;
  fileName: string;
  onApply: () => void;
  onCancel: () => void;
  /** What applying would do to posted copies, shown before the manager confirms. */
  impact?: ReactNode;
}) {
  const { plan } = result;
  const empty = isEmptyPlan(plan);
  const stock = (v: boolean) => (v ? "in stock" : "out of stock");
  return (
    <div className="space-y-4 rounded-card border border-brand-200 bg-paper-raised p-4" data-testid="import-preview">
      <div>
        <h3 className="text-lg font-semibold">Preview of {fileName}</h3>
        <p className="text-sm text-ink-soft">
          {count(plan.rowsInFile, { one: "line", other: "lines" })},{" "}
          {count(plan.familiesInFile, { one: "family", other: "families" })},{" "}
          {count(plan.platformsInFile, { one: "stent platform", other: "stent platforms" })}. Compared with stock
          revision {result.revision}. Nothing has been saved yet.
        </p>
        <p className="mt-1 font-medium">
          {empty
            ? "The file matches the current stock: nothing would change."
            : `This import would make: ${result.summary}.`}
        </p>
      </div>
      <PreviewTable
        title="Families to add"
        head={["Family", "Compliance", "Nominal / rated burst (atm)", "Growth at RBP (mm)", "Sizes"]}
        rows={plan.familiesToAdd.map((f) => [
          f.name,
          f.compliance,
          `${formatAtm(f.nominalAtm)} / ${formatAtm(f.rbpAtm)}`,
          f.growthAtRbpMm === null ? "not recorded" : formatMm(f.growthAtRbpMm),
          String(f.sizes),
        ])}
      />
      <PreviewTable
        title="Families to change"
        head={["Family", "Field", "Now", "After import"]}
        rows={plan.familiesToChange.flatMap((c) =>
          c.fields.map((f) => [
            c.name,
            FIELD_LABELS[f] ?? f,
            formatStockValue(f, c.before[f]),
            formatStockValue(f, c.after[f]),
          ]),
        )}
      />
      <PreviewTable
        title="Sizes to add"
        head={["Family", "Diameter (mm)", "In stock", "Line"]}
        rows={plan.balloonsToAdd.map((b) => [b.family, formatMm(b.diameterMm), stock(b.inStock), String(b.line)])}
      />
      <PreviewTable
        title="Sizes to change"
        head={["Family", "Diameter (mm)", "Now", "After import", "Line"]}
        rows={plan.balloonsToChange.map((b) => [
          b.family,
          formatMm(b.diameterMm),
          stock(b.before.inStock),
          stock(b.after.inStock),
          String(b.line),
        ])}
      />
      <PreviewTable
        title="Sizes to mark out of stock (not in the file)"
        head={["Family", "Diameter (mm)"]}
        rows={plan.balloonsToMarkOutOfStock.map((b) => [b.family, formatMm(b.diameterMm)])}
      />
      <StentPreview plan={plan} />
      {plan.unchangedBalloons ? (
        <p className="text-sm text-ink-soft">
          {count(plan.unchangedBalloons, { one: "size", other: "sizes" })} of the listed families stay as they are.
        </p>
      ) : null}
      {empty ? null : impact}
      <div className="flex flex-wrap justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="button" onClick={onApply} disabled={empty}>
          Apply import
        </Button>
      </div>
    </div>
  );
}

function StentPreview({ plan }: { plan: ImportResult["plan"] }) {
  return (
    <>
      <PreviewTable
        title="Stent platforms to add"
        head={["Platform", "Sizes", "Line"]}
        rows={plan.platformsToAdd.map((p) => [p.name, String(p.sizes), String(p.line)])}
      />
      <PreviewTable
        title="Stent sizes to add"
        head={["Platform", "Nominal (mm)", "Max post-dilatation (mm)", "Line"]}
        rows={plan.stentSizesToAdd.map((s) => [
          s.platform,
          formatMm(s.nominalMm),
          formatMm(s.maxPostDilatationMm),
          String(s.line),
        ])}
      />
      <PreviewTable
        title="Stent limits to change"
        head={["Platform", "Nominal (mm)", "Now (mm)", "After import (mm)", "Line"]}
        rows={plan.stentSizesToChange.map((s) => [
          s.platform,
          formatMm(s.nominalMm),
          formatMm(s.before.maxPostDilatationMm),
          formatMm(s.after.maxPostDilatationMm),
          String(s.line),
        ])}
      />
      <PreviewTable
        title="Stent sizes to remove (in_stock no)"
        head={["Platform", "Nominal (mm)", "Line"]}
        rows={plan.stentSizesToRemove.map((s) => [s.platform, formatMm(s.nominalMm), String(s.line)])}
      />
      {plan.unchangedStentSizes ? (
        <p className="text-sm text-ink-soft">
          {count(plan.unchangedStentSizes, { one: "listed stent size", other: "listed stent sizes" })} stay as they are;
          stent sizes the file leaves out are kept.
        </p>
      ) : null}
    </>
  );
}

function PreviewTable({ title, head, rows }: { title: string; head: string[]; rows: string[][] }) {
  if (rows.length === 0) return null;
  return (
    <div>
      <h4 className="font-semibold">
        {title} ({rows.length})
      </h4>
      <div className="relative mt-1 max-h-64 overflow-auto rounded-md border border-line">
        <table className="w-full text-sm">
          <caption className="sr-only">{title}</caption>
          <thead className="sticky top-0 bg-paper-sunk text-left">
            <tr>
              {head.map((h) => (
                <th key={h} scope="col" className="px-3 py-1.5 font-semibold text-ink-soft">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i} className="border-t border-line">
                {r.map((cell, j) => (
                  <td key={j} className="px-3 py-1.5">
                    {cell}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
