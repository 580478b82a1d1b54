// Where everything sits on a one-page poster, in PDF points from the page's top-left corner.
// Pure arithmetic: the PDF document places its blocks at these boxes, the legibility check reads
// the figure size from here, and the tests find cells by these coordinates. Text heights are
// estimated from character counts with a generous average advance, so blocks never collide.
import { pageSizePt, type Orientation, type PaperId } from "./paper";

/** Inter's metrics as fractions of the font size (advance widths from the font's hmtx table). */
export const INTER = {
  /** Widest balloon label, "2.75" with tabular figures. */
  sizeLabelEm: 2.21,
  /** Average advance of running English text with slack for word wrap (measured 0.47-0.49). */
  textEm: 0.55,
} as const;

/** Cell proportions in units of the figure font size. */
export const CELL = {
  widthEm: 2.7,
  /** Small top line (exact value, corner symbols) + large figure + padding. */
  heightEm: 1.5,
  /** Extra height for the "@ 16 atm" line, only in grids that can push a balloon. */
  pressureLineEm: 0.4,
  /** Small text in a cell relative to the figure. */
  smallRatio: 0.34,
  /** Top of the large figure's line box, from the cell top. */
  figureTopEm: 0.33,
  /** Row and column headings relative to the figure. */
  headingRatio: 0.56,
  rowHeadWidthEm: 1.6,
  colHeadHeightEm: 0.8,
} as const;

export type Box = { x: number; y: number; width: number; height: number };

/**
 * Height of Inter's figures and capitals as a fraction of the font size: OS/2 sCapHeight 1490
 * over unitsPerEm 2048 in fonts/Inter-*.ttf (tests/unit/poster/legibility.test.ts reads both).
 */
export const CAP_HEIGHT_EM = 1490 / 2048;
/**
 * Axis titles, balloon family, rounding rule and law are printed at least this many minutes of
 * arc high at the poster's reading distance: the lower bound of the human-factors guidance the
 * figures follow at 20′ (lib/poster/legibility.ts), so they can be found from where the figures
 * are read.
 */
export const LABEL_MIN_ARCMIN = 16;

/** Font size (pt) whose capitals subtend `arcmin` at `distanceM`. */
export function fontPtForArcmin(distanceM: number, arcmin: number): number {
  const mm = 2 * distanceM * 1000 * Math.tan(((arcmin / 60) * Math.PI) / 180 / 2);
  return ((mm / CAP_HEIGHT_EM) * 72) / 25.4;
}

export type LayoutGridInput = {
  rows: number;
  cols: number;
  /** True when some cell may print "@ N atm" (reach rounding). */
  pressureLine: boolean;
  /** Characters in the grid's title and in each line under it (family, rule, stent limit). */
  titleChars: number;
  subtitleLines: readonly number[];
};

/** Character counts of the texts printed around the grids. */
export type LayoutTexts = {
  title: number;
  /** Law name and formula, one line when it fits. */
  law: number;
  source: number;
  notes: number;
  /** One count per rule exception printed in the edition block. */
  exceptions?: readonly number[];
  caution: number;
  /** One count per legend line (label and explanation). */
  legend: readonly number[];
  url: number;
};

export type LayoutInput = {
  paper: PaperId;
  orientation: Orientation;
  /** Stated reading distance (m): axis titles, family, rule and law are sized for it. */
  readingDistanceM?: number;
  grids: readonly LayoutGridInput[];
  texts: LayoutTexts;
  /** Draft, superseded or withdrawn editions print a banner under the header. */
  banner: boolean;
  /** The lab's logo sits at the header's left. */
  logo: boolean;
};

export type GridLayout = {
  box: Box;
  /** Lookup title and the family/rounding lines. */
  title: Box;
  /** Column axis title, above the column headings. */
  colAxis: Box;
  /** Row axis title strip, left of the row headings (text runs bottom to top). */
  rowAxis: Box;
  /** Top-left corner of the first cell. */
  cellsX: number;
  cellsY: number;
  cellWidth: number;
  cellHeight: number;
  rowHeadWidth: number;
  colHeadHeight: number;
};

export type Fonts = {
  lab: number;
  title: number;
  law: number;
  source: number;
  banner: number;
  gridTitle: number;
  gridSub: number;
  axis: number;
  legend: number;
  edition: number;
  small: number;
  caution: number;
};

export type LegendRow = { swatch: Box; text: Box };

export type PosterLayout = {
  page: { width: number; height: number };
  /** Page short side relative to A4 (595.28 pt): everything but the grid scales with it. */
  scale: number;
  margin: number;
  fonts: Fonts;
  header: Box;
  /** The logo's box (the image is fitted inside), or null. */
  logo: Box | null;
  /** Lab name and chart title. */
  title: Box;
  /** Law name, formula and source, at the header's right. */
  law: Box;
  banner: Box | null;
  gridArea: Box;
  grids: GridLayout[];
  /** Figure font size, pt: the same for every grid on the poster. */
  figurePt: number;
  /** Cells are this much taller than their figure needs, to fill the page (1 = not stretched). */
  cellStretch: number;
  /** Where legend, edition and QR sit: below the grids or in a column at their right. */
  footer: "bottom" | "side";
  caution: Box;
  legend: Box;
  legendRows: LegendRow[];
  edition: Box;
  /** Square reserved for the QR code and its quiet zone. */
  qr: Box;
  qrText: Box;
};

const A4_SHORT_PT = 595.28;
/** Smallest QR symbol (without its quiet zone): 25 mm; larger on bigger paper. */
export const QR_MIN_MM = 25;
export const QR_SHORT_SIDE_FRACTION = 0.075;
/** The smallest QR version has 21 modules; the quiet zone is 4 modules each side (ISO/IEC 18004). */
const QR_BOX_PER_SYMBOL = (21 + 8) / 21;
const LINE = 1.3;

/** Estimated wrapped lines, plus slack: a text box one rounding short of its lines is cut. */
export const linesFor = (chars: number, fontPt: number, widthPt: number) =>
  chars <= 0 ? 0 : Math.max(1, Math.ceil((chars * fontPt * INTER.textEm) / Math.max(widthPt, 1))) + 0.3;

export function fontsFor(scale: number, readingDistanceM?: number): Fonts {
  // The labels an operator reads from the wall never fall below LABEL_MIN_ARCMIN there.
  const label = readingDistanceM ? fontPtForArcmin(readingDistanceM, LABEL_MIN_ARCMIN) : 0;
  return {
    lab: 12 * scale,
    title: 22 * scale,
    law: Math.max(13 * scale, label),
    source: 6.5 * scale,
    banner: 12 * scale,
    gridTitle: Math.max(13 * scale, label * 1.1),
    gridSub: Math.max(9 * scale, label),
    axis: Math.max(11 * scale, label),
    legend: 7.5 * scale,
    edition: 9 * scale,
    small: 7 * scale,
    caution: 9.5 * scale,
  };
}

type GridSize = { width: number; height: number; titleH: number; axisH: number; cellH: number };

/** Cells may grow taller than their figure needs, up to this factor, to fill the page's height. */
export const MAX_CELL_STRETCH = 2.5;

/** Grid block size at a figure size f: fixed text parts plus parts proportional to f. */
function gridSize(g: LayoutGridInput, f: number, fonts: Fonts, scale: number, stretch = 1, slotW = 0): GridSize {
  const axisH = fonts.axis * 1.5;
  const cellH = f * (CELL.heightEm + (g.pressureLine ? CELL.pressureLineEm : 0)) * stretch;
  // A narrow grid still keeps room for its title to wrap into a few lines.
  const width = Math.max(axisH + f * CELL.rowHeadWidthEm + g.cols * f * CELL.widthEm, 200 * scale);
  // The title spans the grid's whole slot in its band, not only the grid's width.
  const titleW = Math.max(width, slotW);
  const titleH =
    fonts.gridTitle * 1.25 * linesFor(g.titleChars, fonts.gridTitle * 1.1, titleW) +
    g.subtitleLines.reduce((h, chars) => h + fonts.gridSub * 1.2 * (linesFor(chars, fonts.gridSub, titleW) - 0.2), 0) +
    4 * scale;
  return {
    width,
    height: titleH + axisH + f * CELL.colHeadHeightEm + g.rows * cellH,
    titleH,
    axisH,
    cellH,
  };
}

/** Ways to arrange 1-3 grids in bands (rows of grids), keeping their order. */
function arrangements(n: number): number[][][] {
  if (n <= 1) return [[[0]]];
  if (n === 2) return [[[0, 1]], [[0], [1]]];
  return [[[0, 1, 2]], [[0], [1], [2]], [[0, 1], [2]], [[0], [1, 2]]];
}

function bandsFit(
  bands: number[][],
  grids: readonly LayoutGridInput[],
  f: number,
  area: Box,
  fonts: Fonts,
  scale: number,
  gap: number,
) {
  let height = 0;
  for (const band of bands) {
    const slot = band.length === 1 ? area.width : 0;
    const sizes = band.map((i) => gridSize(grids[i] as LayoutGridInput, f, fonts, scale, 1, slot));
    const width = sizes.reduce((s, z) => s + z.width, 0) + gap * (band.length - 1);
    if (width > area.width) return false;
    height += Math.max(...sizes.map((z) => z.height));
  }
  return height + gap * (bands.length - 1) <= area.height;
}

/** The largest figure size at which the bands fit the area (bisection: sizes grow with f). */
function largestFigure(
  bands: number[][],
  grids: readonly LayoutGridInput[],
  area: Box,
  fonts: Fonts,
  scale: number,
  gap: number,
  max: number,
) {
  if (area.width <= 0 || area.height <= 0 || !bandsFit(bands, grids, 0, area, fonts, scale, gap)) return 0;
  if (bandsFit(bands, grids, max, area, fonts, scale, gap)) return max;
  let lo = 0;
  let hi = max;
  for (let i = 0; i < 40; i++) {
    const mid = (lo + hi) / 2;
    if (bandsFit(bands, grids, mid, area, fonts, scale, gap)) lo = mid;
    else hi = mid;
  }
  return lo;
}

function bestArrangement(grids: readonly LayoutGridInput[], area: Box, fonts: Fonts, scale: number, gap: number) {
  const max = 60 * scale;
  let best = { f: -1, bands: [[0]] as number[][] };
  for (const bands of arrangements(grids.length)) {
    const f = largestFigure(bands, grids, area, fonts, scale, gap, max);
    if (f > best.f + 1e-9) best = { f, bands };
  }
  return best;
}

/** Total height of the bands at figure size f with cells stretched by `stretch`. */
function bandsHeight(
  bands: number[][],
  grids: readonly LayoutGridInput[],
  f: number,
  fonts: Fonts,
  scale: number,
  gap: number,
  stretch: number,
  areaW: number,
) {
  const slot = (band: number[]) => (band.length === 1 ? areaW : 0);
  return (
    bands.reduce(
      (h, band) =>
        h +
        Math.max(
          ...band.map((i) => gridSize(grids[i] as LayoutGridInput, f, fonts, scale, stretch, slot(band)).height),
        ),
      0,
    ) +
    gap * (bands.length - 1)
  );
}

/** How much taller the cells may be so the grids fill the area's height (1 when they already do). */
function fillStretch(
  bands: number[][],
  grids: readonly LayoutGridInput[],
  f: number,
  area: Box,
  fonts: Fonts,
  scale: number,
  gap: number,
) {
  if (f <= 0) return 1;
  const h1 = bandsHeight(bands, grids, f, fonts, scale, gap, 1, area.width);
  const h2 = bandsHeight(bands, grids, f, fonts, scale, gap, 2, area.width);
  if (h2 <= h1) return 1;
  // Height grows linearly with the stretch; a hair under the exact fit absorbs rounding.
  const s = 1 + ((area.height - h1) / (h2 - h1)) * 0.999;
  return Math.min(MAX_CELL_STRETCH, Math.max(1, s));
}

function placeGrids(
  grids: readonly LayoutGridInput[],
  bands: number[][],
  f: number,
  area: Box,
  fonts: Fonts,
  scale: number,
  gap: number,
  stretch = 1,
): GridLayout[] {
  const bandSizes = bands.map((band) =>
    band.map((i) =>
      gridSize(grids[i] as LayoutGridInput, f, fonts, scale, stretch, band.length === 1 ? area.width : 0),
    ),
  );
  const bandHeights = bandSizes.map((s) => Math.max(...s.map((z) => z.height)));
  const totalH = bandHeights.reduce((a, b) => a + b, 0) + gap * (bands.length - 1);
  let y = area.y + Math.max(0, (area.height - totalH) / 2);
  const out: GridLayout[] = new Array(grids.length);
  bands.forEach((band, b) => {
    const sizes = bandSizes[b] as GridSize[];
    const bandW = sizes.reduce((s, z) => s + z.width, 0) + gap * (band.length - 1);
    let x = area.x + Math.max(0, (area.width - bandW) / 2);
    band.forEach((gi, k) => {
      const z = sizes[k] as GridSize;
      const g = grids[gi] as LayoutGridInput;
      // A grid alone in its band titles across the band; grids side by side keep to their width.
      const titleW = band.length === 1 ? Math.max(z.width, area.width) : z.width;
      const rowHeadWidth = f * CELL.rowHeadWidthEm;
      const colHeadHeight = f * CELL.colHeadHeightEm;
      const cellsX = x + z.axisH + rowHeadWidth;
      const colAxisY = y + z.titleH;
      const cellsY = colAxisY + z.axisH + colHeadHeight;
      out[gi] = {
        box: { x, y, width: z.width, height: z.height },
        // Centred over the grid, as wide as the grid's slot allows.
        title: { x: x + (z.width - titleW) / 2, y, width: titleW, height: z.titleH },
        colAxis: { x: cellsX, y: colAxisY, width: g.cols * f * CELL.widthEm, height: z.axisH },
        rowAxis: { x, y: cellsY, width: z.axisH, height: g.rows * z.cellH },
        cellsX,
        cellsY,
        cellWidth: f * CELL.widthEm,
        cellHeight: z.cellH,
        rowHeadWidth,
        colHeadHeight,
      };
      x += z.width + gap;
    });
    y += (bandHeights[b] as number) + gap;
  });
  return out;
}

/** Legend rows in one or two columns (two when wide): a swatch cell and its wrapped words. */
function legendBlock(texts: LayoutTexts, fonts: Fonts, scale: number, width: number) {
  const swatchH = 24 * scale;
  const swatchW = swatchH * (CELL.widthEm / CELL.heightEm);
  const columns = width > 380 * scale ? 2 : 1;
  const gutter = 12 * scale;
  const colW = (width - gutter * (columns - 1)) / columns;
  const textX = swatchW + 6 * scale;
  const headH = fonts.legend * 1.2 * LINE + 3 * scale;
  const perColumn = Math.ceil(texts.legend.length / columns);
  const ys = new Array<number>(columns).fill(headH);
  const rows = texts.legend.map((chars, i) => {
    const col = Math.floor(i / perColumn);
    const x = col * (colW + gutter);
    const y = ys[col] as number;
    const textH = linesFor(chars, fonts.legend, colW - textX) * fonts.legend * 1.25;
    ys[col] = y + Math.max(swatchH, textH) + 4 * scale;
    return {
      swatch: { x, y, width: swatchW, height: swatchH },
      text: { x: x + textX, y, width: colW - textX, height: textH },
    };
  });
  return { rows, height: Math.max(...ys) };
}

/** Edition number, approval, review-by date, time zone and paper, rule exceptions and notes. */
function editionHeight(texts: LayoutTexts, fonts: Fonts, scale: number, width: number) {
  return (
    fonts.edition * 1.6 * LINE +
    fonts.edition * LINE * (linesFor(60, fonts.edition, width) + linesFor(22, fonts.edition, width)) +
    fonts.small * LINE * linesFor(70, fonts.small, width) +
    (texts.exceptions ?? []).reduce((h, chars) => h + fonts.small * LINE * linesFor(chars, fonts.small, width), 0) +
    (texts.notes > 0 ? fonts.small * LINE * linesFor(texts.notes + 7, fonts.small, width) : 0) +
    10 * scale
  );
}

/** Under the QR code: the short code, large; the short address; one line of what it is for. */
function qrTextHeight(fonts: Fonts, scale: number, width: number) {
  return (
    fonts.edition * 1.5 * LINE +
    fonts.small * 1.1 * LINE +
    fonts.small * LINE * linesFor(70, fonts.small, width) +
    4 * scale
  );
}

/** Font size (pt) at which the short address fits `width` on one line (never cut off). */
export function urlFontPt(chars: number, fonts: Fonts, width: number): number {
  return Math.min(fonts.small * 1.1, width / Math.max(1, chars * 0.62));
}

const offset = (b: Box, dx: number, dy: number): Box => ({ ...b, x: b.x + dx, y: b.y + dy });

/**
 * The poster's layout. Labels are sized for the reading distance, but never beyond 60 % of the
 * figure the page would give with its base label sizes: a crowded page keeps its figures, and
 * the legibility check then says the figures are too small rather than the labels crowding
 * them out.
 */
export function layoutPoster(input: LayoutInput): PosterLayout {
  if (input.grids.length < 1 || input.grids.length > 3) throw new RangeError("A poster has one to three grids");
  const page = pageSizePt(input.paper, input.orientation);
  const scale = Math.min(page.width, page.height) / A4_SHORT_PT;
  const base = fontsFor(scale);
  if (!input.readingDistanceM) return layoutWith(input, base);
  const f0 = layoutWith(input, base).figurePt;
  const wanted = fontsFor(scale, input.readingDistanceM);
  const cap = (k: keyof Fonts) => Math.max(base[k], Math.min(wanted[k], f0 * 0.6));
  return layoutWith(input, {
    ...wanted,
    law: cap("law"),
    gridTitle: cap("gridTitle"),
    gridSub: cap("gridSub"),
    axis: cap("axis"),
  });
}

function layoutWith(input: LayoutInput, fonts: Fonts): PosterLayout {
  const page = pageSizePt(input.paper, input.orientation);
  const short = Math.min(page.width, page.height);
  const scale = short / A4_SHORT_PT;
  const margin = 24 * scale;
  const gap = 10 * scale;
  const innerW = page.width - 2 * margin;
  const { texts } = input;

  // Header: lab and title at the left, law at the right.
  const lawW = Math.min(innerW * 0.5, Math.max(320 * scale, texts.law * fonts.law * 0.6));
  const logoW = input.logo ? 72 * scale : 0;
  const titleX = margin + (input.logo ? logoW + gap : 0);
  const titleW = innerW - lawW - gap - (titleX - margin);
  const leftH = fonts.lab * LINE + fonts.title * 1.15 * linesFor(texts.title, fonts.title * 1.1, titleW);
  const rightH =
    fonts.law * 1.25 * linesFor(texts.law, fonts.law, lawW) +
    fonts.source * LINE * linesFor(texts.source, fonts.source, lawW) +
    2 * scale;
  const header: Box = {
    x: margin,
    y: margin,
    width: innerW,
    height: Math.max(leftH, rightH, input.logo ? 40 * scale : 0),
  };
  const logo: Box | null = input.logo
    ? { x: margin, y: margin, width: logoW, height: Math.min(header.height, logoW) }
    : null;
  const title: Box = { x: titleX, y: margin, width: titleW, height: header.height };
  const law: Box = { x: margin + innerW - lawW, y: margin, width: lawW, height: header.height };
  let top = header.y + header.height + gap;
  let banner: Box | null = null;
  if (input.banner) {
    banner = { x: margin, y: top, width: innerW, height: fonts.banner * 1.9 };
    top += banner.height + gap;
  }

  // Caution: full width at the bottom of the page, always.
  const cautionPad = 6 * scale;
  const cautionH =
    2 * cautionPad + fonts.caution * LINE * linesFor(texts.caution + 10, fonts.caution, innerW - 2 * cautionPad);
  const caution: Box = { x: margin, y: page.height - margin - cautionH, width: innerW, height: cautionH };
  const bottom = caution.y - gap;

  const qrSymbol = Math.max((QR_MIN_MM * 72) / 25.4, short * QR_SHORT_SIDE_FRACTION);
  const qrSide = qrSymbol * QR_BOX_PER_SYMBOL;
  const gridGap = gap * 1.5;

  // Option 1: legend, edition and QR side by side below the grids.
  const qrColW = Math.max(qrSide, 130 * scale, Math.min(texts.url * fonts.small * 1.1 * 0.62, innerW * 0.25));
  const qrTextH = qrTextHeight(fonts, scale, qrColW);
  const restW = innerW - qrColW - 2 * gap;
  const editionW = restW * 0.36;
  const legendW = restW - editionW;
  const legend1 = legendBlock(texts, fonts, scale, legendW);
  const footerH = Math.max(legend1.height, editionHeight(texts, fonts, scale, editionW), qrSide + qrTextH);
  const footerY = bottom - footerH;
  const area1: Box = { x: margin, y: top, width: innerW, height: footerY - gap - top };
  const best1 = bestArrangement(input.grids, area1, fonts, scale, gridGap);

  // Option 2: a column at the right: the legend, then the edition beside the QR code (wins on
  // wide pages, where the grids run out of height first).
  const sideW = Math.max(qrColW * 2.2, Math.min(innerW * 0.3, 300 * scale));
  const legend2 = legendBlock(texts, fonts, scale, sideW);
  const urlW = texts.url * fonts.small * 1.1 * 0.62;
  const qrCol2W = Math.max(qrSide, Math.min(urlW, sideW * 0.5));
  const edition2W = sideW - qrCol2W - gap;
  const edition2H = editionHeight(texts, fonts, scale, edition2W);
  const qrText2H = qrTextHeight(fonts, scale, qrCol2W);
  const sideH = legend2.height + gap + Math.max(edition2H, qrSide + qrText2H);
  const sideFits = top + sideH <= bottom;
  const area2: Box = { x: margin, y: top, width: innerW - sideW - 2 * gap, height: bottom - top };
  const best2 = sideFits ? bestArrangement(input.grids, area2, fonts, scale, gridGap) : { f: -1, bands: [[0]] };

  const side = best2.f > best1.f * 1.02;
  const best = side ? best2 : best1;
  const area = side ? area2 : area1;
  const stretch = fillStretch(best.bands, input.grids, best.f, area, fonts, scale, gridGap);
  const grids = placeGrids(input.grids, best.bands, best.f, area, fonts, scale, gridGap, stretch);

  let legend: Box, edition: Box, qr: Box, qrText: Box, legendRows: LegendRow[];
  if (side) {
    const x = page.width - margin - sideW;
    legend = { x, y: top, width: sideW, height: legend2.height };
    legendRows = legend2.rows.map((r) => ({ swatch: offset(r.swatch, x, top), text: offset(r.text, x, top) }));
    const lowerH = Math.max(edition2H, qrSide + qrText2H);
    const lowerY = bottom - lowerH;
    edition = { x, y: lowerY, width: edition2W, height: lowerH };
    const qrColX = x + sideW - qrCol2W;
    qr = { x: qrColX + (qrCol2W - qrSide) / 2, y: lowerY, width: qrSide, height: qrSide };
    qrText = { x: qrColX, y: lowerY + qrSide, width: qrCol2W, height: qrText2H };
  } else {
    legend = { x: margin, y: footerY, width: legendW, height: footerH };
    legendRows = legend1.rows.map((r) => ({
      swatch: offset(r.swatch, margin, footerY),
      text: offset(r.text, margin, footerY),
    }));
    edition = { x: margin + legendW + gap, y: footerY, width: editionW, height: footerH };
    const qrColX = page.width - margin - qrColW;
    qr = { x: qrColX + (qrColW - qrSide) / 2, y: footerY, width: qrSide, height: qrSide };
    qrText = { x: qrColX, y: footerY + qrSide, width: qrColW, height: qrTextH };
  }

  return {
    page,
    scale,
    margin,
    fonts,
    header,
    logo,
    title,
    law,
    banner,
    gridArea: area,
    grids,
    figurePt: best.f,
    cellStretch: stretch,
    footer: side ? "side" : "bottom",
    caution,
    legend,
    legendRows,
    edition,
    qr,
    qrText,
  };
}

/** Cell box (row r, column c) of a laid-out grid. */
/** Where a grid's cells go: the poster's GridLayout, or the badge card's smaller frame. */
export type GridFrame = Pick<
  GridLayout,
  "cellsX" | "cellsY" | "cellWidth" | "cellHeight" | "rowHeadWidth" | "colHeadHeight"
>;

export function cellBox(
  g: Pick<GridLayout, "cellsX" | "cellsY" | "cellWidth" | "cellHeight">,
  r: number,
  c: number,
): Box {
  return { x: g.cellsX + c * g.cellWidth, y: g.cellsY + r * g.cellHeight, width: g.cellWidth, height: g.cellHeight };
}
