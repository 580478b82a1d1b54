// Which gaps in stock make a chart print sizes beyond its rounding caps, and what stocking one
// size would change: the designer lists them ("stocking 3.25 mm NC would remove 6 oversize cells").
import { formatSizeMm, gridSummary, type LookupKind } from "@/lib/sizing";
import { lookupGrid, type LabStock, type Snapshot } from "./snapshot";

export type StockGap = {
  lookupIndex: number;
  kind: LookupKind;
  diameterMm: number;
  oversizeRemoved: number;
  undersizeRemoved: number;
  message: string;
};

const STEP_MM = 0.25;
const plural = (n: number, word: string) => `${n} ${word} cell${n === 1 ? "" : "s"}`;

export function stockGaps(snapshot: Snapshot, stock: LabStock): StockGap[] {
  const out: StockGap[] = [];
  snapshot.lookups.forEach((l, i) => {
    const family = l.family;
    if (!family) return;
    const grid = (diameters: number[]) => gridSummary(lookupGrid(snapshot, l, { ...family, diameters }));
    const before = grid(family.diameters);
    if (before.oversize + before.undersize === 0) return;
    const full = stock.balloonFamilies.find((f) => f.id === l.familyId);
    const inStock = new Set((full?.balloons ?? []).filter((b) => b.inStock).map((b) => b.diameterMm));
    const candidates = new Set((full?.balloons ?? []).filter((b) => !b.inStock).map((b) => b.diameterMm));
    const sizes = [...inStock].sort((a, b) => a - b);
    if (sizes.length > 1) {
      for (let d = sizes[0]!; d < sizes[sizes.length - 1]!; d = Math.round((d + STEP_MM) * 100) / 100)
        if (!inStock.has(d)) candidates.add(d);
    }
    for (const d of [...candidates].sort((a, b) => a - b)) {
      const after = grid([...family.diameters, d].sort((a, b) => a - b));
      const oversizeRemoved = before.oversize - after.oversize;
      const undersizeRemoved = before.undersize - after.undersize;
      if (oversizeRemoved <= 0 && undersizeRemoved <= 0) continue;
      const removed = [
        oversizeRemoved > 0 ? plural(oversizeRemoved, "oversize") : null,
        undersizeRemoved > 0 ? plural(undersizeRemoved, "undersize") : null,
      ]
        .filter(Boolean)
        .join(" and ");
      out.push({
        lookupIndex: i,
        kind: l.kind,
        diameterMm: d,
        oversizeRemoved,
        undersizeRemoved,
        message: `Stocking ${formatSizeMm(d)} mm ${family.compliance.toUpperCase()} (${family.name}) would remove ${removed} from the ${l.kind} lookup.`,
      });
    }
  });
  return out.sort((a, b) => b.oversizeRemoved + b.undersizeRemoved - (a.oversizeRemoved + a.undersizeRemoved));
}
