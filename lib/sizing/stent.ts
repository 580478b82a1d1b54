import { formatExactMm } from "./format";
export type StentSize = { nominalMm: number; maxPostDilatationMm: number };

/** Stent and post-dilatation comparisons treat sizes within this many mm as equal. */
export const STENT_TOLERANCE_MM = 0.01;

const mm = (x: number): string => formatExactMm(x);

export type StentCandidates = { ok: true; stents: StentSize[] } | { ok: false; reason: string };

/**
 * Every stent the operator might choose for a main branch: common practice sizes the stent to
 * the distal main-branch reference, and operators differ on rounding down or up, so every size
 * whose nominal lies between the nearest nominal at or below the main branch and the nearest at
 * or above it (both within STENT_TOLERANCE_MM) is a candidate. A main branch below the smallest
 * nominal has only the smallest; a main branch above the largest has no covering stent.
 */
export function candidateStents(mbMm: number, platform: readonly StentSize[]): StentCandidates {
  const sizes = platform
    .filter((s) => Number.isFinite(s.nominalMm) && Number.isFinite(s.maxPostDilatationMm))
    .sort((a, b) => a.nominalMm - b.nominalMm || a.maxPostDilatationMm - b.maxPostDilatationMm);
  const above = sizes.find((s) => s.nominalMm >= mbMm - STENT_TOLERANCE_MM);
  if (!above) return { ok: false, reason: `No stent nominal at or above ${mm(mbMm)} mm in the platform` };
  const below = sizes.filter((s) => s.nominalMm <= mbMm + STENT_TOLERANCE_MM).pop() ?? above;
  const lo = Math.min(below.nominalMm, above.nominalMm);
  const hi = Math.max(below.nominalMm, above.nominalMm);
  return { ok: true, stents: sizes.filter((s) => s.nominalMm >= lo && s.nominalMm <= hi) };
}

/** True when the balloon's diameter would exceed the stent's maximum post-dilatation diameter. */
export function potHazard(balloonMm: number, stentSize: StentSize): boolean {
  return balloonMm > stentSize.maxPostDilatationMm + STENT_TOLERANCE_MM;
}

export type PotCheck = { hazard: boolean; detail?: string };

/**
 * Hazard check of a POT balloon over a main branch, with `balloonMm` its diameter at the highest
 * pressure the cell allows. Marked when it exceeds the limit of any candidate stent; when no
 * stent covers the main branch the limit cannot be checked and the cell is marked (conservative).
 */
export function checkPot(balloonMm: number, mbMm: number, platform: readonly StentSize[], at = ""): PotCheck {
  const pick = candidateStents(mbMm, platform);
  if (!pick.ok) {
    return { hazard: true, detail: `${pick.reason}; the post-dilatation limit cannot be checked` };
  }
  const worst = [...pick.stents].sort((a, b) => a.maxPostDilatationMm - b.maxPostDilatationMm)[0] as StentSize;
  if (!potHazard(balloonMm, worst)) return { hazard: false };
  return {
    hazard: true,
    detail:
      `POT ${mm(balloonMm)} mm${at} exceeds the ${mm(worst.nominalMm)} mm stent's maximum ` +
      `post-dilatation diameter (${mm(worst.maxPostDilatationMm)} mm)`,
  };
}
