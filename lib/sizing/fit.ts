import { formatDecimal } from "./format";
import type { LawSpec } from "./law-spec";

/**
 * Published fit ranges, by the side-to-main-branch diameter ratio Dsb/Dmb, as reported in
 * Huo Y, Finet G, Lefevre T, et al. EuroIntervention 2012;7(11): the 7/3 law fitted every
 * type measured; Finet's ratio mainly near-symmetric ones; Murray and area-preserving mainly
 * very asymmetric ones.
 */
export const FINET_FIT_MIN_SB_MB = 0.75;
export const ASYMMETRIC_FIT_MAX_SB_MB = 0.25;

const EPS = 1e-9;

export type LawFit = { withinPublishedFit: boolean; note: string };

/**
 * Whether (mb, sb) lies where the chosen law was reported to fit. A power law with a lab-chosen
 * n has no published range, so it is never marked outside (the note says so).
 */
export function lawFit(spec: LawSpec, mb: number, sb: number): LawFit {
  const q = sb / mb;
  const here = `here Dsb/Dmb = ${formatDecimal(q, 3)}`;
  switch (spec.law) {
    case "huo-kassab":
      return {
        withinPublishedFit: true,
        note: "Huo et al. 2012 report the 7/3 law fitted every bifurcation type measured",
      };
    case "finet": {
      const within = q >= FINET_FIT_MIN_SB_MB - EPS;
      return {
        withinPublishedFit: within,
        note: within
          ? "Within the published fit of Finet's ratio (near-symmetric, Dsb/Dmb ≥ 0.75)"
          : `Finet's ratio fitted mainly near-symmetric bifurcations (Dsb/Dmb ≥ 0.75); ${here}`,
      };
    }
    case "murray":
    case "square": {
      const within = q <= ASYMMETRIC_FIT_MAX_SB_MB + EPS;
      const name = spec.law === "murray" ? "Murray's law" : "The area-preserving law";
      return {
        withinPublishedFit: within,
        note: within
          ? `Within the published fit of ${name} (very asymmetric, Dsb/Dmb ≤ 0.25)`
          : `${name} fitted mainly very asymmetric bifurcations (Dsb/Dmb ≤ 0.25); ${here}`,
      };
    }
    case "power":
      return {
        withinPublishedFit: true,
        note: "No published fit range for a power law with a lab-chosen exponent",
      };
  }
}
