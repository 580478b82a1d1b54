// What is added to a rendered poster after react-pdf has drawn it, with pdf-lib: the status bands
// of an edition that must not be posted, the archive-copy stamp, and the tiled set for office
// printers. The poster page is embedded once as a form XObject and referenced by every sheet, so
// a tiled set costs one poster render plus a little bookkeeping.
import {
  clip,
  concatTransformationMatrix,
  endPath,
  PDFDocument,
  type PDFEmbeddedPage,
  type PDFFont,
  type PDFPage,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  rgb,
  StandardFonts,
} from "pdf-lib";
import { STAMP_WORDS } from "../labels";
import { mmToPt } from "../paper";
import { qrPath, qrSymbol, QR_QUIET_MODULES } from "../qr";
import {
  columnLetter,
  tileCaption,
  tilePlan,
  TILE_MARGIN_MM,
  TILE_OVERLAP_MM,
  type KeepWhole,
  type TileSheet,
} from "../tiles";

/** The words every page of an edition that is not current carries, exactly. */
export const NOT_CURRENT_BAND = STAMP_WORDS.outdated;
export const ARCHIVE_STAMP = "ARCHIVE COPY";

export type Band =
  | {
      kind: "not-current";
      /** ISO date, lab time zone */ date: string;
      reason: string;
      /** Which words the stamp uses; outdated (NOT CURRENT) when absent. */
      state?: "withdrawn" | "superseded" | "outdated";
    }
  | { kind: "unapproved"; state: "draft" | "returned" }
  | { kind: "archive"; date: string };

const UNAPPROVED_REASON = {
  draft: "a draft, not approved: do not use it for patient care",
  returned: "sent back by the approver and never approved: do not use it for patient care",
} as const;

/** The stamp's words and the bands' lines for a band: top (short) and bottom (with the reason). */
export function bandWords(band: Band): { stamp: string; top: string; bottom: string } {
  if (band.kind === "archive")
    return {
      stamp: ARCHIVE_STAMP,
      top: `${ARCHIVE_STAMP} ${band.date}`,
      bottom: `${ARCHIVE_STAMP} ${band.date}: kept for the record, not for posting`,
    };
  if (band.kind === "unapproved") {
    const stamp = STAMP_WORDS[band.state];
    return { stamp, top: stamp, bottom: `${stamp}: ${UNAPPROVED_REASON[band.state]}` };
  }
  const stamp = STAMP_WORDS[band.state ?? "outdated"];
  return { stamp, top: `${stamp} ${band.date}`, bottom: `${stamp} ${band.date}: ${band.reason}` };
}

/** Metadata dates stay fixed so that the same inputs give the same bytes. */
const FIXED_DATE = new Date(Date.UTC(2000, 0, 1));

const RED = rgb(0xa3 / 255, 0x26 / 255, 0x1f / 255);
const WHITE = rgb(1, 1, 1);
const INK = rgb(0x17 / 255, 0x21 / 255, 0x2b / 255);
const ARCHIVE_GREY = rgb(0.25, 0.25, 0.25);

/**
 * The words pdf-lib adds (bands, sheet labels, the assembly map) are set in the PDF standard
 * Helvetica, which every viewer and printer carries, so nothing is embedded: embedding Inter
 * whole costs about a second per set (@pdf-lib/fontkit 1.1.1's subsetter drops most of Inter's
 * glyphs, so it cannot be subset). Helvetica's encoding is WinAnsi: text it cannot encode, such
 * as a chart title with Greek letters, prints with those characters replaced by "?".
 */
async function fontsFor(doc: PDFDocument) {
  const regular = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  return { regular, bold };
}

/** Text the standard fonts can encode (WinAnsi); anything else becomes "?". */
export function winAnsi(font: PDFFont, text: string): string {
  const known = new Set(font.getCharacterSet());
  return [...text].map((ch) => (known.has(ch.codePointAt(0) as number) ? ch : "?")).join("");
}

function fixMetadata(doc: PDFDocument) {
  doc.setCreationDate(FIXED_DATE);
  doc.setModificationDate(FIXED_DATE);
  doc.setProducer("Forkwall");
  doc.setCreator("Forkwall");
}

/** The largest size up to `max` at which `text` fits `width`. */
const fitSize = (font: PDFFont, text: string, width: number, max: number) =>
  Math.min(max, (max * width) / Math.max(1, font.widthOfTextAtSize(winAnsi(font, text), max)));

function centred(
  page: PDFPage,
  font: PDFFont,
  text: string,
  y: number,
  size: number,
  color = WHITE,
  x0 = 0,
  w?: number,
) {
  text = winAnsi(font, text);
  const width = w ?? page.getWidth();
  const s = fitSize(font, text, width * 0.96, size);
  page.drawText(text, { x: x0 + (width - font.widthOfTextAtSize(text, s)) / 2, y, size: s, font, color });
}

/**
 * A band across the top and the bottom of the page (inside the margin every layout keeps) and
 * one across the middle at the page's diagonal, so no cut-down part of the sheet loses it.
 */
function drawBand(page: PDFPage, fonts: { regular: PDFFont; bold: PDFFont }, band: Band, withBottom = true) {
  const w = page.getWidth();
  const h = page.getHeight();
  const short = Math.min(w, h);
  const bh = Math.min(60, Math.max(12, short * 0.032));
  const colour = band.kind === "archive" ? ARCHIVE_GREY : RED;
  const { stamp: head, top, bottom } = bandWords(band);
  page.drawRectangle({ x: 0, y: h - bh, width: w, height: bh, color: colour });
  centred(page, fonts.bold, top, h - bh * 0.72, bh * 0.58);
  if (withBottom) {
    page.drawRectangle({ x: 0, y: 0, width: w, height: bh, color: colour });
    centred(page, fonts.bold, bottom, bh * 0.3, bh * 0.5);
  }

  // Diagonal band through the centre, translucent so the figures beneath stay inspectable (a
  // copy kept for the record must still be readable); an unapproved edition's is stronger.
  const angle = Math.atan2(h, w);
  const diag = Math.hypot(w, h);
  const dh = Math.min(short * 0.09, 160);
  const size = fitSize(fonts.bold, head, diag * 0.7, dh * 0.62);
  const textW = fonts.bold.widthOfTextAtSize(head, size);
  // Drawn in a frame turned about the page's centre, so the band and its words share one axis.
  page.pushOperators(
    pushGraphicsState(),
    concatTransformationMatrix(Math.cos(angle), Math.sin(angle), -Math.sin(angle), Math.cos(angle), w / 2, h / 2),
  );
  const fill = band.kind === "unapproved" ? 0.2 : 0.12;
  page.drawRectangle({ x: -diag / 2, y: -dh / 2, width: diag, height: dh, color: colour, opacity: fill });
  page.drawText(head, { x: -textW / 2, y: -size * 0.36, size, font: fonts.bold, color: colour, opacity: 0.85 });
  page.pushOperators(popGraphicsState());
}

/** Every page of the PDF with the band drawn over it. */
export async function stampBands(pdf: Uint8Array, band: Band): Promise<Buffer> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  const fonts = await fontsFor(doc);
  for (const page of doc.getPages()) drawBand(page, fonts, band);
  fixMetadata(doc);
  return Buffer.from(await doc.save());
}

export type TileOptions = {
  sheet: TileSheet;
  title: string;
  edition: number;
  /** As printed: K7QM-2XHD. */
  shortCode: string;
  shortUrl: string;
  /** What the assembly map's QR code opens: the edition's check page, as on the poster. */
  checkUrl: string;
  band: Band | null;
  /** What the seams must not cut (lib/poster/seams.ts); none when absent. */
  keepWhole?: KeepWhole;
};

/** Side of the assembly map's QR code, quiet zone included (about 0.7 mm a module for a check address). */
export const MAP_QR_MM = 32;

const mm = mmToPt;

function label(page: PDFPage, font: PDFFont, text: string, x: number, y: number, size: number, color = INK) {
  page.drawText(winAnsi(font, text), { x, y, size, font, color });
}

function drawMap(
  page: PDFPage,
  poster: PDFEmbeddedPage,
  plan: ReturnType<typeof tilePlan>,
  fonts: { regular: PDFFont; bold: PDFFont },
  opts: TileOptions,
) {
  const w = page.getWidth();
  const h = page.getHeight();
  const m = mm(TILE_MARGIN_MM);
  // The check QR code at the top right: the poster's own code can fall across two sheets, and
  // the set can be checked before it is put together.
  const qrSide = mm(MAP_QR_MM);
  const qr = qrSymbol(opts.checkUrl);
  const modules = qr.size + 2 * QR_QUIET_MODULES;
  const qrX = w - m - qrSide;
  const qrTop = h - m;
  page.drawRectangle({ x: qrX, y: qrTop - qrSide, width: qrSide, height: qrSide, color: WHITE });
  page.drawSvgPath(qrPath(qr), { x: qrX, y: qrTop, scale: qrSide / modules, color: rgb(0, 0, 0) });
  const scanText = winAnsi(fonts.regular, "Scan to check this edition");
  const scanSize = fitSize(fonts.regular, scanText, qrSide, 7);
  label(
    page,
    fonts.regular,
    scanText,
    qrX + (qrSide - fonts.regular.widthOfTextAtSize(scanText, scanSize)) / 2,
    qrTop - qrSide - scanSize - 1,
    scanSize,
  );
  const textW = qrX - 8 - m;
  const lines = [
    `Assembly map: ${opts.title}, edition ${opts.edition}`,
    `${plan.tiles.length} sheets at 100 % scale (${plan.cols} across, columns A-${columnLetter(plan.cols - 1)}; ${plan.rows} down, rows 1-${plan.rows}). Print at actual size, not "fit to page".`,
    `Each sheet overlaps its neighbours by at least ${TILE_OVERLAP_MM} mm (seams run between cells, never through a figure): trim the left and top margins of every sheet except column A and row 1 along the corner marks, lay it over its neighbour up to the dashed line, and tape it from behind.`,
    `Code ${opts.shortCode}: ${opts.shortUrl}`,
  ].map((l) => winAnsi(fonts.regular, l));
  let y = h - m - 14;
  label(page, fonts.bold, lines[0] as string, m, y, fitSize(fonts.bold, lines[0] as string, textW, 13));
  y -= 6;
  for (const line of lines.slice(1)) {
    // Wrap by words into the width.
    const words = line.split(" ");
    let cur = "";
    const size = 8.5;
    for (const word of words) {
      const next = cur ? `${cur} ${word}` : word;
      if (fonts.regular.widthOfTextAtSize(next, size) > textW && cur) {
        y -= size * 1.3;
        label(page, fonts.regular, cur, m, y, size);
        cur = word;
      } else cur = next;
    }
    y -= size * 1.3;
    label(page, fonts.regular, cur, m, y, size);
  }
  // The poster in miniature with the sheet grid over it.
  const areaTop = Math.min(y, qrTop - qrSide - scanSize - 2) - 10;
  const areaH = areaTop - m - 16;
  const areaW = w - 2 * m;
  const totalW = mm(plan.totalWidthMm);
  const totalH = mm(plan.totalHeightMm);
  const k = Math.min(areaW / totalW, areaH / totalH);
  const ox = m + (areaW - totalW * k) / 2;
  const oyTop = areaTop - (areaH - totalH * k) / 2;
  page.drawPage(poster, {
    x: ox + mm(plan.offsetXMm) * k,
    y: oyTop - mm(plan.offsetYMm) * k - poster.height * k,
    xScale: k,
    yScale: k,
    opacity: 0.45,
  });
  for (const t of plan.tiles) {
    const x = ox + mm(t.x + plan.offsetXMm) * k;
    const top = oyTop - mm(t.y + plan.offsetYMm) * k;
    const tw = mm(t.width) * k;
    const th = mm(t.height) * k;
    page.drawRectangle({ x, y: top - th, width: tw, height: th, borderColor: RED, borderWidth: 1, opacity: 0 });
    const size = Math.min(th * 0.3, tw * 0.3, 28);
    const lw = fonts.bold.widthOfTextAtSize(t.label, size);
    page.drawRectangle({
      x: x + tw / 2 - lw / 2 - 2,
      y: top - th / 2 - size * 0.45,
      width: lw + 4,
      height: size * 1.05,
      color: WHITE,
      opacity: 0.85,
    });
    label(page, fonts.bold, t.label, x + tw / 2 - lw / 2, top - th / 2 - size * 0.3, size, RED);
  }
  label(page, fonts.regular, `Assembly map (page 1) · ${opts.shortCode}`, m, m * 0.45, 7);
}

/** The poster at 100 % over sheets of `opts.sheet`, page 1 an assembly map, every sheet labelled. */
export async function tilePoster(pdf: Uint8Array, opts: TileOptions): Promise<Buffer> {
  const src = await PDFDocument.load(pdf, { updateMetadata: false });
  const srcPage = src.getPage(0);
  const posterWpt = srcPage.getWidth();
  const posterHpt = srcPage.getHeight();
  const toMm = (pt: number) => (pt * 25.4) / 72;
  const plan = tilePlan(toMm(posterWpt), toMm(posterHpt), opts.sheet, opts.keepWhole);
  const out = await PDFDocument.create({ updateMetadata: false });
  const fonts = await fontsFor(out);
  const [poster] = await out.embedPdf(src, [0]);
  if (!poster) throw new Error("The poster has no page");
  const sw = mm(plan.sheetWidthMm);
  const sh = mm(plan.sheetHeightMm);
  const m = mm(TILE_MARGIN_MM);
  const winW = mm(plan.windowWidthMm);
  const winH = mm(plan.windowHeightMm);

  drawMap(out.addPage([sw, sh]), poster, plan, fonts, opts);

  for (const t of plan.tiles) {
    const page = out.addPage([sw, sh]);
    // The window: the sheet less its margins, clipped so nothing prints into the margins.
    page.pushOperators(pushGraphicsState(), rectangle(m, m, winW, winH), clip(), endPath());
    page.drawPage(poster, { x: m - mm(t.x), y: sh - m + mm(t.y) - posterHpt });
    page.pushOperators(popGraphicsState());

    // Corner marks at the window's corners, in the margins: cut along them.
    const tick = m * 0.7;
    const mark = { thickness: 0.6, color: INK };
    for (const [cx, cy] of [
      [m, m],
      [m + winW, m],
      [m, m + winH],
      [m + winW, m + winH],
    ] as const) {
      const dx = cx === m ? -1 : 1;
      const dy = cy === m ? -1 : 1;
      page.drawLine({ start: { x: cx + dx * 2, y: cy }, end: { x: cx + dx * tick, y: cy }, ...mark });
      page.drawLine({ start: { x: cx, y: cy + dy * 2 }, end: { x: cx, y: cy + dy * tick }, ...mark });
    }
    // Where the next sheet's cut edge lies: dashed lines across the overlap, with arrows in the margin.
    const dash = { thickness: 0.5, color: RED, dashArray: [3, 3] };
    const right = plan.tiles.find((n) => n.row === t.row && n.col === t.col + 1);
    const below = plan.tiles.find((n) => n.col === t.col && n.row === t.row + 1);
    if (right) {
      const x = m + mm(right.x - t.x);
      page.drawLine({ start: { x, y: m }, end: { x, y: m + winH }, ...dash });
      label(page, fonts.bold, `${columnLetter(t.col + 1)}${t.row + 1}`, x + 1, m + winH + 2, 6, RED);
    }
    if (below) {
      const y = sh - m - mm(below.y - t.y);
      page.drawLine({ start: { x: m, y }, end: { x: m + winW, y }, ...dash });
      label(page, fonts.bold, `${columnLetter(t.col)}${t.row + 2}`, m + winW + 2, y - 2, 6, RED);
    }
    const caption = `${tileCaption(plan, t)} · ${opts.title}, edition ${opts.edition} · Code ${opts.shortCode}`;
    const size = fitSize(fonts.bold, caption, sw - 2 * m, 8);
    label(page, fonts.bold, caption, m, m * 0.35, size);
    // The sheet's own label again at the top, beside the code: a stray sheet names itself.
    const head = `${t.label} · Code ${opts.shortCode}`;
    label(page, fonts.bold, head, m + m * 0.5, sh - m + 3, 7);
  }
  if (opts.band) {
    // The bottom margin keeps the sheet's label; the top band and the diagonal carry the status.
    for (const page of out.getPages()) drawBand(page, fonts, opts.band, false);
  }
  out.setTitle(`${opts.title} (${plan.tiles.length} ${opts.sheet} sheets)`);
  fixMetadata(out);
  return Buffer.from(await out.save());
}
