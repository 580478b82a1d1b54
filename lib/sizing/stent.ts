export type StentSize = { nominalMm: number; maxPostDilatationMm: number };

/** Stent and post-dilatation comparisons treat sizes within this many mm as equal. */
export const STENT_TOLERANCE_MM = 0.01;

export type StentPick = { ok: true; stent: StentSize } | { ok: false; reason: string };

const mm = (x: number): string => x.toFixed(2);

/**
 * The main-branch stent: common practice sizes it to the distal main-branch reference, so this
 * takes the smallest nominal at or above the main-branch diameter (within STENT_TOLERANCE_MM);
 * a duplicated nominal uses its lower post-dilatation limit.
 */
export function stentForMainBranch(mbMm: number, platform: readonly StentSize[]): StentPick {
  const fits = platform
    .filter((s) => Number.isFinite(s.nominalMm) && s.nominalMm >= mbMm - STENT_TOLERANCE_MM)
    .sort((a, b) => a.nominalMm - b.nominalMm || a.maxPostDilatationMm - b.maxPostDilatationMm);
  const stent = fits[0];
  if (stent === undefined) {
    return { ok: false, reason: `No stent nominal at or above ${mm(mbMm)} mm in the platform` };
  }
  return { ok: true, stent };
}

/** True when the POT balloon would exceed the stent's maximum post-dilatation diameter. */
export function potHazard(potBalloonMm: number, stentSize: StentSize): boolean {
  return potBalloonMm > stentSize.maxPostDilatationMm + STENT_TOLERANCE_MM;
}

export type PotCheck = { hazard: boolean; detail?: string };

/**
 * Hazard check for one POT diameter over a main branch. When no stent in the platform covers
 * the main branch the limit cannot be checked, and the cell is marked (conservative).
 */
export function checkPot(potMm: number, mbMm: number, platform: readonly StentSize[]): PotCheck {
  const pick = stentForMainBranch(mbMm, platform);
  if (!pick.ok) {
    return { hazard: true, detail: `${pick.reason}; the post-dilatation limit cannot be checked` };
  }
  const { stent } = pick;
  if (!potHazard(potMm, stent)) return { hazard: false };
  return {
    hazard: true,
    detail:
      `POT ${mm(potMm)} mm exceeds the ${mm(stent.nominalMm)} mm stent's maximum ` +
      `post-dilatation diameter (${mm(stent.maxPostDilatationMm)} mm)`,
  };
}
