// What the stent lines of a stock CSV would change. Unlike balloons, stent sizes carry no stock
// flag: a line with in_stock "no" removes that size; sizes the file leaves out stay as they are.
import type { LineIssue, StentCsvRow } from "./csv";
import { formatMm, hundredths, nameKey } from "./format";
import type { StentPlatformView } from "./types";

export type PlatformAdd = { name: string; line: number; sizes: number };
export type StentSizeAdd = {
  platform: string;
  platformId: number | null;
  nominalMm: number;
  maxPostDilatationMm: number;
  line: number;
};
export type StentSizeChange = {
  id: number;
  platform: string;
  platformId: number;
  nominalMm: number;
  before: { maxPostDilatationMm: number };
  after: { maxPostDilatationMm: number };
  line: number;
};
export type StentSizeRemove = { id: number; platform: string; platformId: number; nominalMm: number; line: number };

export type StentPlan = {
  platformsToAdd: PlatformAdd[];
  stentSizesToAdd: StentSizeAdd[];
  stentSizesToChange: StentSizeChange[];
  stentSizesToRemove: StentSizeRemove[];
  unchangedStentSizes: number;
  platformsInFile: number;
};

export const emptyStentPlan = (): StentPlan => ({
  platformsToAdd: [],
  stentSizesToAdd: [],
  stentSizesToChange: [],
  stentSizesToRemove: [],
  unchangedStentSizes: 0,
  platformsInFile: 0,
});

type FilePlatform = { name: string; line: number; rows: StentCsvRow[] };

function groupPlatforms(rows: StentCsvRow[], issues: LineIssue[]): Map<string, FilePlatform> {
  const platforms = new Map<string, FilePlatform>();
  for (const row of rows) {
    const key = nameKey(row.platform);
    const plat = platforms.get(key) ?? { name: row.platform, line: row.line, rows: [] };
    platforms.set(key, plat);
    const twin = plat.rows.find((r) => hundredths(r.nominalMm) === hundredths(row.nominalMm));
    if (twin)
      issues.push({
        line: row.line,
        column: "diameter_mm",
        message: `diameter_mm: ${formatMm(row.nominalMm)} mm is already listed for ${plat.name} on line ${twin.line}.`,
      });
    else plat.rows.push(row);
  }
  return platforms;
}

function planExistingPlatform(plat: FilePlatform, existing: StentPlatformView, plan: StentPlan) {
  const sizes = new Map(existing.sizes.map((s) => [hundredths(s.nominalMm), s]));
  const named = { platform: existing.name, platformId: existing.id };
  for (const row of plat.rows) {
    const size = sizes.get(hundredths(row.nominalMm));
    if (!size) {
      if (row.inStock)
        plan.stentSizesToAdd.push({
          ...named,
          nominalMm: row.nominalMm,
          maxPostDilatationMm: row.maxPostDilatationMm,
          line: row.line,
        });
    } else if (!row.inStock) {
      plan.stentSizesToRemove.push({ id: size.id, ...named, nominalMm: size.nominalMm, line: row.line });
    } else if (hundredths(size.maxPostDilatationMm) !== hundredths(row.maxPostDilatationMm)) {
      plan.stentSizesToChange.push({
        id: size.id,
        ...named,
        nominalMm: size.nominalMm,
        before: { maxPostDilatationMm: size.maxPostDilatationMm },
        after: { maxPostDilatationMm: row.maxPostDilatationMm },
        line: row.line,
      });
    } else plan.unchangedStentSizes += 1;
  }
}

/** Groups stent lines by platform, checks them against each other and the current stock, and lists the changes. */
export function planStentImport(
  current: StentPlatformView[],
  rows: StentCsvRow[],
): { plan: StentPlan; issues: LineIssue[] } {
  const issues: LineIssue[] = [];
  const platforms = groupPlatforms(rows, issues);
  const byName = new Map(current.map((p) => [nameKey(p.name), p]));
  const plan = emptyStentPlan();
  plan.platformsInFile = platforms.size;
  for (const plat of platforms.values()) {
    const existing = byName.get(nameKey(plat.name));
    if (existing) {
      planExistingPlatform(plat, existing, plan);
      continue;
    }
    const kept = plat.rows.filter((r) => r.inStock);
    plan.platformsToAdd.push({ name: plat.name, line: plat.line, sizes: kept.length });
    for (const row of kept)
      plan.stentSizesToAdd.push({
        platform: plat.name,
        platformId: null,
        nominalMm: row.nominalMm,
        maxPostDilatationMm: row.maxPostDilatationMm,
        line: row.line,
      });
  }
  const order = (a: { platform: string; nominalMm: number }, b: { platform: string; nominalMm: number }) =>
    a.platform.localeCompare(b.platform) || a.nominalMm - b.nominalMm;
  plan.stentSizesToAdd.sort(order);
  plan.stentSizesToChange.sort(order);
  plan.stentSizesToRemove.sort(order);
  return { plan, issues };
}
