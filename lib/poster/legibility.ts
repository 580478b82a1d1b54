// Can the cell figures be read from where the operator stands? Human-factors guidance asks
// characters to subtend at least 16 and preferably 20-22 minutes of arc at the reading distance
// (US NRC NUREG-0700; ISO 9241-3; the figures are from memory, not checked against the texts):
// the required height is h = 2·d·tan(θ/2), about 5.82 mm per metre at 20'.
import { layoutPoster, type LayoutInput } from "./layout";
import { PAPERS, ptToMm, type PaperId } from "./paper";

export const MIN_ARCMIN = 20;

/**
 * Height of Inter's figures as a fraction of the font size: OS/2 sCapHeight 1490 over
 * unitsPerEm 2048 in fonts/Inter-*.ttf (version 4.001). Inter's default figures are lining, so
 * digits stand at cap height (round ones overshoot by about 1%, which is not counted).
 * tests/unit/poster/legibility.test.ts reads both numbers from the font file.
 */
export const FIGURE_HEIGHT_EM = 1490 / 2048;

const arcminToRad = (a: number) => (a / 60) * (Math.PI / 180);

/** Height (mm) that subtends `arcmin` minutes of arc at `distanceM` metres. */
export function requiredHeightMm(distanceM: number, arcmin = MIN_ARCMIN): number {
  return 2 * distanceM * 1000 * Math.tan(arcminToRad(arcmin) / 2);
}

/** Minutes of arc subtended by a height (mm) at a distance (m). */
export function subtendedArcmin(heightMm: number, distanceM: number): number {
  return ((2 * Math.atan(heightMm / (2 * distanceM * 1000)) * 180) / Math.PI) * 60;
}

/** Farthest distance (m) at which a height (mm) still subtends the minimum arc. */
export function maxReadingDistanceM(heightMm: number, arcmin = MIN_ARCMIN): number {
  return heightMm / (2 * 1000 * Math.tan(arcminToRad(arcmin) / 2));
}

export const figureHeightMm = (figurePt: number) => ptToMm(figurePt * FIGURE_HEIGHT_EM);

export type Legibility = {
  figureHeightMm: number;
  requiredMm: number;
  subtendedArcmin: number;
  ok: boolean;
  maxDistanceM: number;
  /** Smallest paper of the same series and orientation whose figures pass; null if none does. */
  smallestPaper: PaperId | null;
  /** Most columns per grid that pass on the chosen paper; null if even one column fails. */
  maxColumns: number | null;
  /** Plain advice when the figures are too small; null when they pass. */
  suggestion: string | null;
};

const SERIES: readonly (readonly PaperId[])[] = [
  ["A4", "A3", "A2", "A1", "A0"],
  ["LETTER", "TABLOID", "ARCH-C", "ARCH-D"],
];

const fmt1 = (x: number) => (Math.round(x * 10) / 10).toFixed(1);

function passes(input: LayoutInput, requiredMm: number): boolean {
  return figureHeightMm(layoutPoster(input).figurePt) >= requiredMm;
}

/** Legibility of a poster laid out from `input`, read from `readingDistanceM`. */
export function posterLegibility(input: LayoutInput & { readingDistanceM: number }): Legibility {
  const d = input.readingDistanceM;
  if (!(d > 0)) throw new RangeError("The reading distance must be greater than zero");
  const requiredMm = requiredHeightMm(d);
  const heightMm = figureHeightMm(layoutPoster(input).figurePt);
  const ok = heightMm >= requiredMm;

  const series = SERIES.find((s) => s.includes(input.paper)) as readonly PaperId[];
  const smallestPaper = series.find((p) => passes({ ...input, paper: p }, requiredMm)) ?? null;
  const widest = Math.max(...input.grids.map((g) => g.cols));
  let maxColumns: number | null = null;
  for (let n = widest; n >= 1; n--) {
    const grids = input.grids.map((g) => ({ ...g, cols: Math.min(g.cols, n) }));
    if (passes({ ...input, grids }, requiredMm)) {
      maxColumns = n;
      break;
    }
  }

  const otherOrientation = input.orientation === "portrait" ? "landscape" : "portrait";
  const turnPasses = !ok && passes({ ...input, orientation: otherOrientation }, requiredMm);

  let suggestion: string | null = null;
  if (!ok) {
    const options: string[] = [];
    if (turnPasses) options.push(`print it ${otherOrientation}`);
    const bigger = smallestPaper && series.indexOf(smallestPaper) > series.indexOf(input.paper) ? smallestPaper : null;
    if (bigger) options.push(`use ${PAPERS[bigger].label} or larger`);
    if (maxColumns !== null && maxColumns < widest)
      options.push(`show at most ${maxColumns} column${maxColumns === 1 ? "" : "s"}`);
    else if (maxColumns === null) options.push("show fewer rows");
    // Headings grow with the reading distance; on a small sheet they can leave the grid no room.
    const fits = heightMm >= 0.5;
    if (fits) options.push(`read it from ${fmt1(maxReadingDistanceM(heightMm))} m or closer`);
    else if (!options.length) options.push("use larger paper or a shorter reading distance");
    const advice = options.join(", or ");
    const found = fits
      ? `Figures are ${fmt1(heightMm)} mm high; at ${fmt1(d)} m they need ${fmt1(requiredMm)} mm (${MIN_ARCMIN}′ of arc). `
      : `At ${fmt1(d)} m the headings leave this paper no room for the grid; its figures need ${fmt1(requiredMm)} mm (${MIN_ARCMIN}′ of arc). `;
    suggestion = found + advice.charAt(0).toUpperCase() + advice.slice(1) + ".";
  }

  return {
    figureHeightMm: heightMm,
    requiredMm,
    subtendedArcmin: subtendedArcmin(heightMm, d),
    ok,
    maxDistanceM: maxReadingDistanceM(heightMm),
    smallestPaper,
    maxColumns,
    suggestion,
  };
}

/** The small line a poster prints about its own legibility. */
export function legibilityLine(l: Legibility, readingDistanceM: number): string {
  const verdict = l.ok ? "meets" : "BELOW";
  return `Figures ${fmt1(l.figureHeightMm)} mm high, ${fmt1(l.subtendedArcmin)}′ of arc at ${fmt1(readingDistanceM)} m: ${verdict} the ${MIN_ARCMIN}′ guide (legible to ${fmt1(l.maxDistanceM)} m)`;
}
