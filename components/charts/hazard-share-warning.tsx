"use client";

import { hazardShares } from "@/lib/charts/hazard-share";
import { buildSnapshot, type LabStock } from "@/lib/charts/snapshot";
import type { ChartDefinition } from "@/lib/validation/chart";

/** The designer's warning when the stent-limit mark covers more than a third of a lookup's sized cells. */
export function HazardShareWarning({ definition, stock }: { definition: ChartDefinition; stock: LabStock }) {
  const snapshot = buildSnapshot({ labName: "", definition, stock, logoSha256: null });
  const shares = hazardShares(snapshot, stock);
  if (shares.length === 0) return null;
  return (
    <div
      role="status"
      data-testid="hazard-share"
      className="mt-3 rounded-md border border-warn/60 bg-warn-soft px-4 py-3 text-sm"
    >
      <p className="font-semibold">! The stent-limit mark covers most of the sheet</p>
      {shares.map((s) => (
        <div key={s.lookupIndex} className="mt-1">
          <p>{s.message}</p>
          {s.changes.length > 0 ? (
            <ul className="mt-1 list-disc pl-5">
              {s.changes.map((c) => (
                <li key={c.message}>{c.message}</li>
              ))}
            </ul>
          ) : (
            <p className="mt-1">No platform or balloon family in stock marks fewer cells.</p>
          )}
        </div>
      ))}
    </div>
  );
}
