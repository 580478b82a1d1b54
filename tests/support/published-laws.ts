// The published formulas written out directly, independent of lib/sizing, for checks.
/** Finet G, et al. EuroIntervention 2008: Dp = 0.678 (Dmb + Dsb). */
export const finetParent = (mb: number, sb: number, ratio = 0.678) => ratio * (mb + sb);
/** Area-preserving square law (compared in Huo et al., EuroIntervention 2012): Dsb = sqrt(Dp^2 - Dmb^2). */
export const squareSide = (parent: number, mb: number) => Math.sqrt(parent * parent - mb * mb);
/** Murray CD, PNAS 1926: Dp^3 = Dmb^3 + Dsb^3. */
export const murrayParent = (mb: number, sb: number) => Math.cbrt(mb ** 3 + sb ** 3);
