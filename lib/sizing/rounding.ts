import { formatExactMm } from "./format";
export type RoundingRule = "up" | "down" | "nearest" | "reach";
export type LookupKind = "proximal" | "side" | "main";

/** POT rounds up, side branch rounds down (common practice); main branch to the nearest size. */
export const DEFAULT_ROUNDING: Readonly<Record<LookupKind, RoundingRule>> = {
  proximal: "up",
  side: "down",
  main: "nearest",
};

/** A target within this many mm of a stocked size is that size. */
export const STOCK_TOLERANCE_MM = 0.01;

const SLACK = 1e-9;

export type BalloonFamilyStock = {
  name: string;
  compliance: "nc" | "sc";
  nominalAtm: number;
  rbpAtm: number;
  /** Diameter gained from nominal pressure to rated burst pressure, mm; null when unknown. */
  growthAtRbpMm: number | null;
  /** In-stock diameters only, mm. */
  diameters: number[];
};

export type BalloonPickOk = {
  ok: true;
  diameterMm: number;
  /** Whole atm above nominal when the size must be pushed to reach the target; null = nominal. */
  pressureAtm: number | null;
  /** The rule actually applied ("reach" without usable growth data falls back to "up"). */
  rule: RoundingRule;
  /** Expected diameter at the stated pressure (the nominal diameter when pressureAtm is null). */
  expectedMm: number;
};
export type BalloonPickFail = {
  ok: false;
  code: "above_stock" | "below_stock" | "no_stock";
  reason: string;
};
export type BalloonPick = BalloonPickOk | BalloonPickFail;

const mm = (x: number): string => formatExactMm(x);

/** True when the family carries compliance data that reach-by-pressure can use. */
export function hasGrowthData(family: BalloonFamilyStock): boolean {
  const g = family.growthAtRbpMm;
  return (
    g !== null &&
    Number.isFinite(g) &&
    g > 0 &&
    Number.isFinite(family.nominalAtm) &&
    Number.isFinite(family.rbpAtm) &&
    family.rbpAtm > family.nominalAtm
  );
}

/** Linear compliance between nominal pressure and rated burst pressure (the lab's own chart rules). */
export function balloonDiameterAt(family: BalloonFamilyStock, nominalMm: number, pressureAtm: number): number {
  if (!hasGrowthData(family)) return nominalMm;
  const growth = family.growthAtRbpMm as number;
  return nominalMm + (growth * (pressureAtm - family.nominalAtm)) / (family.rbpAtm - family.nominalAtm);
}

/**
 * From an exact target diameter to a stocked balloon.
 * - Any rule: a stocked size within STOCK_TOLERANCE_MM of the target is that size.
 * - A target beyond either end of the stocked range gets no size under any rule: the stock
 *   does not cover that vessel, so the chart says so rather than jump to a distant size.
 * - up: smallest stocked above the target; down: largest stocked below it.
 * - nearest: closest stocked size; an exact tie goes to the smaller (the conservative side).
 * - reach: of the stocked sizes whose diameter, linear from nominal pressure to rated burst
 *   pressure, reaches the target, the one that needs the lowest pressure: the largest size below
 *   the target, with the pressure rounded up to a whole atm and never above rated burst pressure.
 *   When it cannot reach, the next size up at nominal. Without growth data, reach is up.
 */
export function pickBalloon(targetMm: number, family: BalloonFamilyStock, rule: RoundingRule): BalloonPick {
  if (!Number.isFinite(targetMm) || targetMm <= 0) {
    throw new RangeError("The target diameter must be a positive number of mm");
  }
  const sizes = [...new Set(family.diameters.filter((d) => Number.isFinite(d) && d > 0))].sort((a, b) => a - b);
  if (sizes.length === 0) return { ok: false, code: "no_stock", reason: "No sizes in stock" };

  const applied: RoundingRule = rule === "reach" && !hasGrowthData(family) ? "up" : rule;
  const atNominal = (d: number): BalloonPickOk => ({
    ok: true,
    diameterMm: d,
    pressureAtm: null,
    rule: applied,
    expectedMm: d,
  });

  let match: number | undefined;
  for (const d of sizes) {
    if (Math.abs(d - targetMm) <= STOCK_TOLERANCE_MM + SLACK) {
      if (match === undefined || Math.abs(d - targetMm) < Math.abs(match - targetMm)) match = d;
    }
  }
  if (match !== undefined) return atNominal(match);

  const smallest = sizes[0] as number;
  const largest = sizes[sizes.length - 1] as number;
  const above = sizes.find((d) => d > targetMm);
  const below = sizes.filter((d) => d < targetMm).pop();
  const aboveStock = (reason: string): BalloonPickFail => ({
    ok: false,
    code: "above_stock",
    reason,
  });
  const belowStock: BalloonPickFail = {
    ok: false,
    code: "below_stock",
    reason: `Below the smallest stocked size (${mm(smallest)} mm)`,
  };

  if (targetMm < smallest) return belowStock;
  if (targetMm > largest && applied !== "reach") {
    return aboveStock(
      applied === "up"
        ? `No stocked size at or above ${mm(targetMm)} mm`
        : `Above the largest stocked size (${mm(largest)} mm)`,
    );
  }

  switch (applied) {
    case "up":
      return atNominal(above as number);
    case "down":
      return atNominal(below as number);
    case "nearest":
      return (above as number) - targetMm < targetMm - (below as number) - SLACK
        ? atNominal(above as number)
        : atNominal(below as number);
    case "reach": {
      // The largest size below the target needs the lowest pressure; if even it cannot reach the
      // target by rated burst pressure, no smaller one can, and the next size up is used at nominal.
      if (below !== undefined) {
        const growth = family.growthAtRbpMm as number;
        const span = family.rbpAtm - family.nominalAtm;
        const atm = Math.ceil(family.nominalAtm + (span * (targetMm - below)) / growth - SLACK);
        if (atm <= family.rbpAtm + SLACK)
          return {
            ok: true,
            diameterMm: below,
            pressureAtm: atm,
            rule: applied,
            expectedMm: balloonDiameterAt(family, below, atm),
          };
      }
      if (above !== undefined) return atNominal(above);
      return aboveStock(`No stocked size at or above ${mm(targetMm)} mm, and none reaches it by rated burst pressure`);
    }
  }
}
