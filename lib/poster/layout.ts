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

export type LayoutGridInput = {
  rows: number;
  cols: number;
  /** True when some cell may print "@ N atm" (reach rounding). */
  pressureLine: boolean;
  /** Characters in the grid's title and in its subtitle. */
  titleChars: number;
  subtitleChars: number;
};

/** Character counts of the texts printed around the grids. */
export type LayoutTexts = {
  title: number;
  source: number;
  notes: number;
  caution: number;
  /** One count per legend line (label and explanation). */
  legend: readonly number[];
  url: number;
};

export type LayoutInput = {
  paper: PaperId;
  orientation: Orientation;
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

export function fontsFor(scale: number): Fonts {
  return {
    lab: 12 * scale,
    title: 22 * scale,
    law: 12 * scale,
    source: 6.5 * scale,
    banner: 12 * scale,
    gridTitle: 12 * scale,
    gridSub: 7.5 * scale,
    axis: 9 * scale,
    legend: 7.5 * scale,
    edition: 9 * scale,
    small: 7 * scale,
    caution: 9.5 * scale,
  };
}

type GridSize = { width: number; height: number; titleH: number; axisH: number; cellH: number };

/** Grid block size at a figure size f: fixed text parts plus parts proportional to f. */
function gridSize(g: LayoutGridInput, f: number, fonts: Fonts, scale: number): GridSize {
  const axisH = fonts.axis * 1.5;
  const cellH = f * (CELL.heightEm + (g.pressureLine ? CELL.pressureLineEm : 0));
  // A narrow grid still keeps room for its title to wrap into a few lines.
  const width = Math.max(axisH + f * CELL.rowHeadWidthEm + g.cols * f * CELL.widthEm, 200 * scale);
  const titleH =
    fonts.gridTitle * 1.25 * linesFor(g.titleChars, fonts.gridTitle * 1.1, width) +
    fonts.gridSub * 1.25 * linesFor(g.subtitleChars, fonts.gridSub, width) +
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
    const sizes = band.map((i) => gridSize(grids[i] as LayoutGridInput, f, fonts, scale));
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

function placeGrids(
  grids: readonly LayoutGridInput[],
  bands: number[][],
  f: number,
  area: Box,
  fonts: Fonts,
  scale: number,
  gap: number,
): GridLayout[] {
  const bandSizes = bands.map((band) => band.map((i) => gridSize(grids[i] as LayoutGridInput, f, fonts, scale)));
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
      const rowHeadWidth = f * CELL.rowHeadWidthEm;
      const colHeadHeight = f * CELL.colHeadHeightEm;
      const cellsX = x + z.axisH + rowHeadWidth;
      const colAxisY = y + z.titleH;
      const cellsY = colAxisY + z.axisH + colHeadHeight;
      out[gi] = {
        box: { x, y, width: z.width, height: z.height },
        title: { x, y, width: z.width, height: z.titleH },
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

function editionHeight(texts: LayoutTexts, fonts: Fonts, scale: number, width: number) {
  return (
    fonts.edition * 1.6 * LINE +
    fonts.edition * LINE * 2 * linesFor(40, fonts.edition, width) +
    fonts.small * LINE * linesFor(140, fonts.small, width) +
    (texts.notes > 0 ? fonts.small * LINE * linesFor(texts.notes + 7, fonts.small, width) : 0) +
    8 * scale
  );
}

const offset = (b: Box, dx: number, dy: number): Box => ({ ...b, x: b.x + dx, y: b.y + dy });

export function layoutPoster(input: LayoutInput): PosterLayout {
  if (input.grids.length < 1 || input.grids.length > 3) throw new RangeError("A poster has one to three grids");
  const page = pageSizePt(input.paper, input.orientation);
  const short = Math.min(page.width, page.height);
  const scale = short / A4_SHORT_PT;
  const fonts = fontsFor(scale);
  const margin = 24 * scale;
  const gap = 10 * scale;
  const innerW = page.width - 2 * margin;
  const { texts } = input;

  // Header: lab and title at the left, law at the right.
  const lawW = Math.min(innerW * 0.42, 320 * scale);
  const logoW = input.logo ? 72 * scale : 0;
  const titleX = margin + (input.logo ? logoW + gap : 0);
  const titleW = innerW - lawW - gap - (titleX - margin);
  const leftH = fonts.lab * LINE + fonts.title * 1.15 * linesFor(texts.title, fonts.title * 1.1, titleW);
  const rightH = fonts.law * LINE * 2 + fonts.source * LINE * linesFor(texts.source, fonts.source, lawW) + 2 * scale;
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
  const restW = innerW - qrColW - 2 * gap;
  const editionW = restW * 0.36;
  const legendW = restW - editionW;
  const legend1 = legendBlock(texts, fonts, scale, legendW);
  const qrTextH =
    fonts.small * 1.1 * LINE * linesFor(texts.url, fonts.small * 1.1, qrColW) +
    fonts.small * LINE * linesFor(60, fonts.small, qrColW) +
    4 * scale;
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
  const qrText2H =
    fonts.small * 1.1 * LINE * linesFor(texts.url, fonts.small * 1.1, qrCol2W) +
    fonts.small * LINE * linesFor(60, fonts.small, qrCol2W) +
    4 * scale;
  const sideH = legend2.height + gap + Math.max(edition2H, qrSide + qrText2H);
  const sideFits = top + sideH <= bottom;
  const area2: Box = { x: margin, y: top, width: innerW - sideW - 2 * gap, height: bottom - top };
  const best2 = sideFits ? bestArrangement(input.grids, area2, fonts, scale, gridGap) : { f: -1, bands: [[0]] };

  const side = best2.f > best1.f * 1.02;
  const best = side ? best2 : best1;
  const area = side ? area2 : area1;
  const grids = placeGrids(input.grids, best.bands, best.f, area, fonts, scale, gridGap);

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
export function cellBox(g: GridLayout, r: number, c: number): Box {
  return { x: g.cellsX + c * g.cellWidth, y: g.cellsY + r * g.cellHeight, width: g.cellWidth, height: g.cellHeight };
}
