// When the stent-limit mark covers more than a third of a lookup's sized cells, the orange fill
// becomes the norm of the sheet and stops warning anyone: the designer says so, and names the
// stock or stent change that would mark fewer cells (another platform or balloon family in the
// lab's stock, or one stent size with a larger post-dilatation limit).
import { formatSizeMm, type Grid, type LookupKind, type StentSize } from "@/lib/sizing";
import { lookupGrid, type LabStock, type Snapshot } from "./snapshot";

/** More than this share of a lookup's sized cells marked and the mark no longer stands out. */
export const HAZARD_SHARE_LIMIT = 1 / 3;

export type HazardChange = { message: string; hazard: number };

export type HazardShare = {
  lookupIndex: number;
  kind: LookupKind;
  sized: number;
  hazard: number;
  message: string;
  /** Changes that mark fewer cells, the best first (at most three). */
  changes: HazardChange[];
};

const STEP_MM = 0.25;

/** Sized cells that carry the stent-limit mark. */
function counts(grid: Grid): { sized: number; hazard: number } {
  const sized = grid.cells.flat().filter((c) => c.exact.ok && !(c.balloon && !c.balloon.ok));
  return { sized: sized.length, hazard: sized.filter((c) => c.flags.hazard).length };
}

const cellsWord = (n: number) => `${n} cell${n === 1 ? "" : "s"}`;

function stentChanges(snapshot: Snapshot, i: number, stock: LabStock, hazard: number): HazardChange[] {
  const l = snapshot.lookups[i]!;
  const withStent = (stent: Snapshot["stent"]) => counts(lookupGrid({ ...snapshot, stent }, l)).hazard;
  const out: HazardChange[] = [];
  for (const p of stock.stentPlatforms) {
    if (p.name === snapshot.stent?.name) continue;
    const n = withStent({ name: p.name, sizes: p.sizes });
    if (n < hazard) out.push({ hazard: n, message: `Choose the ${p.name} stent platform: ${cellsWord(n)} marked.` });
  }
  const sizes = snapshot.stent?.sizes ?? [];
  sizes.forEach((s, k) => {
    for (let more = STEP_MM; more <= 1 + 1e-9; more += STEP_MM) {
      const raised: StentSize[] = sizes.map((t, j) =>
        j === k ? { ...t, maxPostDilatationMm: s.maxPostDilatationMm + more } : t,
      );
      const n = withStent({ name: snapshot.stent!.name, sizes: raised });
      if (n >= hazard) continue;
      out.push({
        hazard: n,
        message: `A ${formatSizeMm(s.nominalMm)} mm stent that post-dilates to ${formatSizeMm(s.maxPostDilatationMm + more)} mm (the ${snapshot.stent!.name}'s is recorded as ${formatSizeMm(s.maxPostDilatationMm)} mm): ${cellsWord(n)} marked. Check the platform's recorded limits.`,
      });
      break;
    }
  });
  return out;
}

/** Other families in stock, when they mark fewer cells without leaving more cells unsized. */
function familyChanges(snapshot: Snapshot, i: number, stock: LabStock, now: { sized: number; hazard: number }) {
  const hazard = now.hazard;
  const l = snapshot.lookups[i]!;
  const out: HazardChange[] = [];
  for (const f of stock.balloonFamilies) {
    if (f.id === l.familyId) continue;
    const diameters = f.balloons
      .filter((b) => b.inStock)
      .map((b) => b.diameterMm)
      .sort((a, b) => a - b);
    if (diameters.length === 0) continue;
    const family = { ...f, diameters };
    const after = counts(lookupGrid(snapshot, { ...l, family, familyId: f.id }));
    if (after.hazard < hazard && after.sized >= now.sized)
      out.push({
        hazard: after.hazard,
        message: `Use the ${f.name} balloons (${f.compliance.toUpperCase()}): ${cellsWord(after.hazard)} marked.`,
      });
  }
  return out;
}

/** Every lookup whose sized cells carry the stent-limit mark more than a third of the time. */
export function hazardShares(snapshot: Snapshot, stock: LabStock): HazardShare[] {
  const out: HazardShare[] = [];
  snapshot.lookups.forEach((l, i) => {
    const { sized, hazard } = counts(lookupGrid(snapshot, l));
    if (sized === 0 || hazard <= sized * HAZARD_SHARE_LIMIT) return;
    const changes = [
      ...stentChanges(snapshot, i, stock, hazard),
      ...familyChanges(snapshot, i, stock, { sized, hazard }),
    ]
      .sort((a, b) => a.hazard - b.hazard)
      .slice(0, 3);
    out.push({
      lookupIndex: i,
      kind: l.kind,
      sized,
      hazard,
      message: `${hazard} of ${sized} sized cells of the ${l.kind} lookup carry the stent-limit mark: when most of the sheet is orange, the mark no longer stands out.`,
      changes,
    });
  });
  return out;
}
