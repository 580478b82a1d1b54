// Poster paper sizes. ISO 216 A-series in millimetres; US sizes in inches: Letter and Tabloid
// (ANSI A and B) and the architectural ARCH C and ARCH D, as tabulated in ASME Y14.1.
export const PAPER_IDS = ["A4", "A3", "A2", "A1", "A0", "LETTER", "TABLOID", "ARCH-C", "ARCH-D"] as const;
export type PaperId = (typeof PAPER_IDS)[number];
export const ORIENTATIONS = ["portrait", "landscape"] as const;
export type Orientation = (typeof ORIENTATIONS)[number];

export const POINTS_PER_INCH = 72;
export const MM_PER_INCH = 25.4;

type PaperDef = { label: string; widthMm: number; heightMm: number; standard: string };

const inch = (w: number, h: number) => ({ widthMm: w * MM_PER_INCH, heightMm: h * MM_PER_INCH });

export const PAPERS: Readonly<Record<PaperId, PaperDef>> = {
  A4: { label: "A4", widthMm: 210, heightMm: 297, standard: "ISO 216" },
  A3: { label: "A3", widthMm: 297, heightMm: 420, standard: "ISO 216" },
  A2: { label: "A2", widthMm: 420, heightMm: 594, standard: "ISO 216" },
  A1: { label: "A1", widthMm: 594, heightMm: 841, standard: "ISO 216" },
  A0: { label: "A0", widthMm: 841, heightMm: 1189, standard: "ISO 216" },
  LETTER: { label: "US Letter", ...inch(8.5, 11), standard: "ASME Y14.1 (ANSI A)" },
  TABLOID: { label: "Tabloid", ...inch(11, 17), standard: "ASME Y14.1 (ANSI B)" },
  "ARCH-C": { label: "ARCH C", ...inch(18, 24), standard: "ASME Y14.1 (ARCH C)" },
  "ARCH-D": { label: "ARCH D", ...inch(24, 36), standard: "ASME Y14.1 (ARCH D)" },
};

export const mmToPt = (mm: number) => (mm * POINTS_PER_INCH) / MM_PER_INCH;
export const ptToMm = (pt: number) => (pt * MM_PER_INCH) / POINTS_PER_INCH;

/** Page size in PDF points (1/72 in), short side first for portrait. */
export function pageSizePt(paper: PaperId, orientation: Orientation): { width: number; height: number } {
  const { widthMm, heightMm } = PAPERS[paper];
  const w = mmToPt(widthMm);
  const h = mmToPt(heightMm);
  return orientation === "portrait" ? { width: w, height: h } : { width: h, height: w };
}
