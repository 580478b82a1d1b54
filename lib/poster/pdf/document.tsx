import path from "node:path";
import { Canvas, Document, Font, Image, Page, Path, Rect, Svg, Text, View } from "@react-pdf/renderer";
import type { Style } from "@react-pdf/stylesheet";
import { installShapingCache } from "./shaping-cache";
import { shortFingerprint } from "@/lib/charts/fingerprint";
import { snapshotGrids, type Snapshot } from "@/lib/charts/snapshot";
import type { EditionStatus } from "@/lib/editions/states";
import type { NumberFormat } from "@/lib/format/numbers";
import { cellTextRuns, gridTextRuns, type TextRun } from "@/lib/poster/cell-text";
import { cellGraphics, type DrawnCell } from "@/lib/poster/draw";
import {
  approvalText,
  axisTitles,
  formulaLines,
  formulaRuns,
  gridSubtitleParts,
  localiseNumbers,
  lookupTitle,
  reviewText,
  VESSEL_SYMBOLS,
  shortUrl,
  statusBanner,
} from "@/lib/poster/labels";
import {
  cellBox,
  CELL,
  layoutPoster,
  urlFontPt,
  type Box,
  type GridFrame,
  type GridLayout,
  type PosterLayout,
} from "@/lib/poster/layout";
import {
  cellView,
  CORNER_MARKS,
  MARKS,
  PALETTE,
  type CellView,
  type LegendEntry,
  type MarkId,
} from "@/lib/poster/marks";
import { exceptionLine } from "@/lib/poster/exceptions";
import { layoutInputFor, posterLegend } from "@/lib/poster/model";
import { PAPERS } from "@/lib/poster/paper";
import { qrPath, qrSymbol, QR_QUIET_MODULES } from "@/lib/poster/qr";
import { lawCitation, lawFormula, lawName, type Grid } from "@/lib/sizing";

export type PosterInput = {
  snapshot: Snapshot;
  edition: {
    number: number;
    status: EditionStatus;
    approvedAt: Date | null;
    approvedByName: string | null;
    /** When the approved content is due for review (approved editions). */
    reviewBy?: Date | null;
    fingerprint: string;
    /** What the QR code encodes: the check page. */
    checkUrl: string;
    /** As printed, K7QM-2XHD, and the short address printed under the QR code (APP_URL/c/<code>). */
    shortCode?: string;
    codeUrl?: string;
  };
  logo: { bytes: Buffer; mime: "image/png" | "image/jpeg" } | null;
  /** How the lab prints dates and decimals; UTC and a decimal point when absent. */
  lab?: { timeZone: string; numberFormat: NumberFormat };
};

export const POSTER_FONT = "Inter";
/**
 * The poster prints two weights, from the files in fonts/: bold for what is read from the wall
 * (figures, headings, axis titles, the rounding rule) and regular for the rest. Each further
 * weight costs a first render another font's layout tables to read.
 */
const WEIGHT_FILES = { 400: "Inter-Regular.ttf", 700: "Inter-Bold.ttf" } as const;
/** Metadata date of editions that carry no approval date: fixed, so drafts render byte-identically. */
export const POSTER_EPOCH = new Date(Date.UTC(2000, 0, 1));

let fontsRegistered = false;
let shapingCached = false;

/**
 * Registers Inter from fonts/ (absolute paths), turns hyphenation off and puts the shaping cache
 * on the fonts react-pdf loads (lib/poster/pdf/shaping-cache.ts); safe to call often.
 */
export async function preparePosterFonts(): Promise<void> {
  if (!fontsRegistered) {
    const file = (name: string) => path.join(process.cwd(), "fonts", name);
    Font.register({
      family: POSTER_FONT,
      fonts: ([400, 700] as const).map((fontWeight) => ({ src: file(WEIGHT_FILES[fontWeight]), fontWeight })),
    });
    Font.registerHyphenationCallback((word) => [word]);
    fontsRegistered = true;
  }
  if (!shapingCached) {
    await Font.load({ fontFamily: POSTER_FONT, fontWeight: 400 });
    const loaded: unknown = Font.getFont({ fontFamily: POSTER_FONT, fontWeight: 400 })?.data;
    if (loaded && typeof loaded === "object") installShapingCache(loaded);
    shapingCached = true;
  }
}

export const TNUM: Style = { fontFeatureSettings: ["tnum"] };
export const at = (b: Box): Style => ({ position: "absolute", left: b.x, top: b.y, width: b.width, height: b.height });

/** Everything the document draws, computed once from the input (pure). */
export function posterModel(input: PosterInput) {
  const { snapshot, edition } = input;
  const grids = snapshotGrids(snapshot);
  const layoutInput = layoutInputFor(snapshot, edition, input.logo !== null, grids);
  const layout = layoutPoster(layoutInput);
  // The legibility figures stay in the designer and the approval gate: the poster does not print
  // them, so the render does not compute them (twenty-odd layouts of other papers and widths).
  return { grids, layout, legend: posterLegend(snapshot, grids), qr: qrSymbol(edition.checkUrl) };
}

/** The legend's sample: a real cell of the chart with that mark, or a made-up one when none exists. */
const sampleView = (e: LegendEntry): CellView => e.sample ?? swatchView(e.mark);

/** A sample cell for each legend line, drawn with the same marks as the grid. */
function swatchView(mark: MarkId | "sized"): CellView {
  const def = mark === "sized" ? null : MARKS[mark];
  return {
    primary: mark === "sized" ? "3.0" : mark === "noStock" ? "▲" : mark === "noSize" ? "—" : "3.5",
    primaryIsSize: mark === "sized" || CORNER_MARKS.includes(mark),
    pressure: null,
    exact: mark === "noSize" ? null : "(3.42)",
    marks: def ? [def.id] : [],
    background: def?.background ?? PALETTE.cell,
    hatch: def?.hatch ?? false,
    border: def?.border ?? 0,
    description: "",
  };
}

/** The subset of pdfkit's document that react-pdf's Canvas hands to `paint` (methods used here). */
type Painter = {
  font(src: unknown): Painter;
  fontSize(size: number): Painter;
  fillColor(color: string): Painter;
  translate(x: number, y: number): Painter;
  text(text: string, x: number, y: number, options: Record<string, unknown>): Painter;
};

/**
 * Many single lines (cell words, grid headings) in one Canvas element, drawn with pdfkit's own
 * text calls. A poster has several hundred such lines; as react-pdf Text elements each one cost a
 * layout node, a text-layout pass and a font switch, which made up most of a first render. Each
 * line keeps the place, font, size, features and colour the Text elements gave it: pdfkit puts a
 * line's baseline one ascent below `y`, as react-pdf does at a line height of 1 (the poster's
 * tools tests check centring and insets in the rendered PDF). Lines are drawn in the order given,
 * which is the PDF's reading order; the font changes only where the weight does, and the font
 * react-pdf has already loaded for that weight is reused, else pdfkit opens the same file.
 */
export function TextLayer({ runs: all }: { runs: TextRun[] }) {
  // Headings grown for a long reading distance can leave a small sheet's grid no room at all; the
  // approval gate names that case, and there is nothing legible to draw.
  const runs = all.filter((r) => r.size > 0 && (!r.align || r.align.width > 0));
  if (runs.length === 0) return null;
  const x0 = Math.min(...runs.map((r) => r.x));
  const y0 = Math.min(...runs.map((r) => r.y));
  const width = Math.max(...runs.map((r) => r.x + (r.align?.width ?? r.size))) - x0;
  const height = Math.max(...runs.map((r) => r.y + r.size)) - y0;
  const paint = (painter: Painter) => {
    // The Canvas origin is its top left corner; the runs are in page coordinates.
    painter.translate(-x0, -y0).fillColor(PALETTE.ink);
    let current: TextRun["weight"] | null = null;
    for (const r of runs) {
      if (r.weight !== current) {
        const loaded: unknown = Font.getFont({ fontFamily: POSTER_FONT, fontWeight: r.weight })?.data;
        painter.font(loaded ?? path.join(process.cwd(), "fonts", WEIGHT_FILES[r.weight]));
        current = r.weight;
      }
      const features = r.tnum ? ["tnum"] : [];
      const options = r.align
        ? { width: r.align.width, align: r.align.to, lineBreak: false, features }
        : { lineBreak: false, features };
      painter.fontSize(r.size).text(r.text, r.x, r.y, options);
    }
    return null;
  };
  return <Canvas style={at({ x: x0, y: y0, width, height })} paint={paint} />;
}

export function CellGraphicsSvg({ cells, rule, hatchWidth }: { cells: DrawnCell[]; rule: number; hatchWidth: number }) {
  const g = cellGraphics(cells);
  // The SVG spans just the drawn cells (in page coordinates through its viewBox), never the page.
  const x0 = Math.min(...cells.map((c) => c.box.x)) - rule;
  const y0 = Math.min(...cells.map((c) => c.box.y)) - rule;
  const x1 = Math.max(...cells.map((c) => c.box.x + c.box.width)) + rule;
  const y1 = Math.max(...cells.map((c) => c.box.y + c.box.height)) + rule;
  return (
    <Svg
      style={at({ x: x0, y: y0, width: x1 - x0, height: y1 - y0 })}
      width={x1 - x0}
      height={y1 - y0}
      viewBox={`${x0} ${y0} ${x1 - x0} ${y1 - y0}`}
    >
      {g.fills.map((f) => (
        <Path key={f.color} d={f.d} fill={f.color} />
      ))}
      {g.hatch ? <Path d={g.hatch} stroke={PALETTE.hatch} strokeWidth={hatchWidth} /> : null}
      <Path d={g.rules} stroke={PALETTE.rule} strokeWidth={rule} strokeLinecap="square" fill="none" />
      {g.borders.map((b, i) => (
        <Rect
          key={`b${i}`}
          x={b.box.x}
          y={b.box.y}
          width={b.box.width}
          height={b.box.height}
          stroke={PALETTE.ink}
          strokeWidth={b.width}
          fill="none"
        />
      ))}
    </Svg>
  );
}

export const heading = (box: Box): DrawnCell => ({
  box,
  view: { background: PALETTE.heading, hatch: false, border: 0 },
});

/** One grid's corner, column and row headings, and cells, placed by `g`: the poster and the card draw grids alike. */
export function gridCells(grid: Grid, g: GridFrame): DrawnCell[] {
  const out: DrawnCell[] = [
    heading({
      x: g.cellsX - g.rowHeadWidth,
      y: g.cellsY - g.colHeadHeight,
      width: g.rowHeadWidth,
      height: g.colHeadHeight,
    }),
  ];
  grid.colAxis.values.forEach((_, j) =>
    out.push(
      heading({
        x: g.cellsX + j * g.cellWidth,
        y: g.cellsY - g.colHeadHeight,
        width: g.cellWidth,
        height: g.colHeadHeight,
      }),
    ),
  );
  grid.rowAxis.values.forEach((_, i) =>
    out.push(
      heading({
        x: g.cellsX - g.rowHeadWidth,
        y: g.cellsY + i * g.cellHeight,
        width: g.rowHeadWidth,
        height: g.cellHeight,
      }),
    ),
  );
  grid.cells.forEach((row, i) => row.forEach((cell, j) => out.push({ box: cellBox(g, i, j), view: cellView(cell) })));
  return out;
}

/** Headings, corner and cells of every grid, plus the legend's swatches: what the SVG layer draws. */
function drawnCells(grids: Grid[], layout: PosterLayout, legend: LegendEntry[]): DrawnCell[] {
  const out: DrawnCell[] = [];
  grids.forEach((grid, gi) => {
    out.push(...gridCells(grid, layout.grids[gi] as GridLayout));
  });
  legend.forEach((e, i) => {
    const row = layout.legendRows[i];
    if (row) out.push({ box: row.swatch, view: sampleView(e) });
  });
  return out;
}

function GridTexts({
  grid,
  g,
  layout,
  sub,
  nf,
  typed,
}: {
  grid: Grid;
  g: GridLayout;
  layout: PosterLayout;
  sub: string[];
  nf: NumberFormat;
  /** Names the lab typed (family, stent platform): their separators are never changed. */
  typed: readonly string[];
}) {
  const { fonts } = layout;
  const loc = (t: string) => localiseNumbers(t, nf, typed);
  const f = layout.figurePt;
  const titles = axisTitles(grid);
  const head = f * CELL.headingRatio;
  const rowAxisPt = Math.min(fonts.axis, g.rowAxis.height / ((titles.rows.length + 2) * 0.6));
  const centre = { x: g.rowAxis.x + g.rowAxis.width / 2, y: g.rowAxis.y + g.rowAxis.height / 2 };
  return (
    <>
      <View style={at(g.title)}>
        <Text style={{ fontSize: fonts.gridTitle, fontWeight: 700, lineHeight: 1.25 }}>{lookupTitle(grid.kind)}</Text>
        {sub.map((line, i) => (
          <Text key={i} style={{ fontSize: fonts.gridSub, lineHeight: 1.2, fontWeight: i === 1 ? 700 : 400 }}>
            {loc(line)}
          </Text>
        ))}
      </View>
      <Text
        style={{
          ...at(g.colAxis),
          fontSize: fonts.axis,
          fontWeight: 700,
          textAlign: "center",
          paddingTop: fonts.axis * 0.2,
        }}
      >{`${titles.cols} →`}</Text>
      {/* Rotated to run bottom to top, so a left arrow at its end points down the rows. */}
      <View
        style={{
          position: "absolute",
          left: centre.x - g.rowAxis.height / 2,
          top: centre.y - g.rowAxis.width / 2,
          width: g.rowAxis.height,
          height: g.rowAxis.width,
          transform: "rotate(-90deg)",
        }}
      >
        <Text
          style={{ fontSize: rowAxisPt, fontWeight: 700, textAlign: "center", paddingTop: fonts.axis * 0.2 }}
        >{`${titles.rows} ←`}</Text>
      </View>
      <Text
        style={{
          position: "absolute",
          left: g.cellsX - g.rowHeadWidth,
          width: g.rowHeadWidth - f * 0.08,
          top: g.cellsY - g.colHeadHeight + f * 0.04,
          fontSize: head * 0.5,
          fontWeight: 700,
          textAlign: "right",
        }}
      >
        {`${VESSEL_SYMBOLS[grid.colAxis.vessel]} →`}
      </Text>
      <Text
        style={{
          position: "absolute",
          left: g.cellsX - g.rowHeadWidth + f * 0.08,
          top: g.cellsY - head * 0.5 * 1.2 - f * 0.04,
          fontSize: head * 0.5,
          fontWeight: 700,
        }}
      >
        {`${VESSEL_SYMBOLS[grid.rowAxis.vessel]} ↓`}
      </Text>
      <TextLayer runs={gridTextRuns(grid, g, f, head, nf)} />
    </>
  );
}

function Legend({ layout, entries, nf }: { layout: PosterLayout; entries: LegendEntry[]; nf: NumberFormat }) {
  const { fonts, legend } = layout;
  return (
    <>
      <Text
        style={{
          position: "absolute",
          left: legend.x,
          top: legend.y,
          width: legend.width,
          fontSize: fonts.legend * 1.2,
          fontWeight: 700,
        }}
      >
        How to read a cell
      </Text>
      {entries.map((e, i) => {
        const row = layout.legendRows[i];
        if (!row) return null;
        return (
          <View key={e.mark}>
            {/* One layer per line keeps each sample before its words in the PDF's reading order. */}
            <TextLayer
              runs={cellTextRuns(
                { view: sampleView(e), box: row.swatch, f: row.swatch.height / CELL.heightEm, pressureLine: false },
                nf,
              )}
            />
            <Text
              style={{
                position: "absolute",
                left: row.text.x,
                top: row.text.y,
                width: row.text.width,
                fontSize: fonts.legend,
                lineHeight: 1.25,
              }}
            >
              <Text style={{ fontWeight: 700 }}>{`${e.label}. `}</Text>
              {localiseNumbers(e.text, nf)}
            </Text>
          </View>
        );
      })}
    </>
  );
}

function Qr({
  layout,
  url,
  code,
  qr,
}: {
  layout: PosterLayout;
  url: string;
  code: string | null;
  qr: ReturnType<typeof qrSymbol>;
}) {
  const n = qr.size + 2 * QR_QUIET_MODULES;
  const { fonts } = layout;
  const printed = shortUrl(url);
  return (
    <>
      <Svg style={at(layout.qr)} width={layout.qr.width} height={layout.qr.height} viewBox={`0 0 ${n} ${n}`}>
        <Rect x={0} y={0} width={n} height={n} fill="#ffffff" />
        <Path d={qrPath(qr)} fill="#000000" />
      </Svg>
      <View style={{ ...at(layout.qrText), alignItems: "center" }}>
        {code ? (
          <Text style={{ fontSize: fonts.edition * 1.5, fontWeight: 700, textAlign: "center", ...TNUM }}>{code}</Text>
        ) : null}
        <Text
          style={{
            fontSize: urlFontPt(printed.length, fonts, layout.qrText.width),
            fontWeight: 400,
            textAlign: "center",
          }}
        >
          {printed}
        </Text>
        <Text
          style={{ fontSize: fonts.small, textAlign: "center", color: PALETTE.inkSoft, marginTop: fonts.small * 0.3 }}
        >
          Scan the code, or type the address, to check this is the current edition
        </Text>
      </View>
    </>
  );
}

/** Logo, lab name and chart title at the left; the law, its formula and its source at the right. */
function Header({ input, layout }: { input: PosterInput; layout: PosterLayout }) {
  const { snapshot, logo } = input;
  const { fonts, scale } = layout;
  const loc = (t: string) => localiseNumbers(t, input.lab?.numberFormat ?? "point");
  const name = `Law: ${loc(lawName(snapshot.law))}`;
  const text = loc(lawFormula(snapshot.law));
  const whole = formulaLines(`${name}: ${text}`, fonts.law, layout.law.width).lines.length === 1;
  const formula = whole ? { lines: [text], size: fonts.law } : formulaLines(text, fonts.law, layout.law.width);
  return (
    <>
      {logo && layout.logo ? (
        // eslint-disable-next-line jsx-a11y/alt-text -- react-pdf's Image has no alt; the lab name is printed beside it
        <Image
          src={{ data: logo.bytes, format: logo.mime === "image/png" ? "png" : "jpg" }}
          style={{ ...at(layout.logo), objectFit: "contain" }}
        />
      ) : null}
      <View style={{ position: "absolute", left: layout.title.x, top: layout.title.y, width: layout.title.width }}>
        <Text style={{ fontSize: fonts.lab, fontWeight: 400, color: PALETTE.inkSoft }}>{snapshot.lab.name}</Text>
        <Text style={{ fontSize: fonts.title, fontWeight: 700, lineHeight: 1.15 }}>{snapshot.title}</Text>
      </View>
      <View style={at(layout.law)}>
        {/* One line when name and formula fit it; else each piece of the formula on its own line,
            sized to fit it, so it breaks only after "=". */}
        {whole ? null : (
          <Text style={{ fontSize: fonts.law, fontWeight: 700, textAlign: "right", lineHeight: 1.25 }}>{name}</Text>
        )}
        {formula.lines.map((line, j) => (
          <Text key={j} style={{ fontSize: formula.size, fontWeight: 700, textAlign: "right", lineHeight: 1.25 }}>
            {whole ? `${name}: ` : ""}
            {formulaRuns(line).map((r, i) =>
              r.sup ? (
                <Text key={i} style={{ verticalAlign: "super", fontSize: formula.size * 0.62 }}>
                  {r.text}
                </Text>
              ) : (
                r.text
              ),
            )}
          </Text>
        ))}
        <Text style={{ fontSize: fonts.source, textAlign: "right", color: PALETTE.inkSoft, marginTop: 2 * scale }}>
          {lawCitation(snapshot.law)}
        </Text>
      </View>
    </>
  );
}

function Caution({ layout, caution }: { layout: PosterLayout; caution: string }) {
  const { fonts, scale } = layout;
  return (
    <View
      style={{
        ...at(layout.caution),
        backgroundColor: PALETTE.caution,
        borderWidth: 1.5 * scale,
        borderColor: PALETTE.cautionBorder,
        padding: 4.5 * scale,
      }}
    >
      <Text style={{ fontSize: fonts.caution, lineHeight: 1.3 }}>
        <Text style={{ fontWeight: 700 }}>CAUTION. </Text>
        {caution}
      </Text>
    </View>
  );
}

/** Edition number, approval and review-by dates, print settings, rule exceptions and notes. */
function EditionBlock({ input, layout }: { input: PosterInput; layout: PosterLayout }) {
  const { snapshot, edition } = input;
  const { fonts } = layout;
  const tz = input.lab?.timeZone ?? "UTC";
  const loc = (t: string) => localiseNumbers(t, input.lab?.numberFormat ?? "point");
  const review = edition.status === "approved" ? reviewText(edition.reviewBy, tz) : null;
  return (
    <View style={at(layout.edition)}>
      <Text style={{ fontSize: fonts.edition * 1.6, fontWeight: 700 }}>{`Edition ${edition.number}`}</Text>
      <Text
        style={{
          fontSize: fonts.edition,
          fontWeight: edition.status === "approved" ? 400 : 700,
          marginTop: fonts.edition * 0.2,
        }}
      >
        {approvalText(edition, tz)}
      </Text>
      {review ? <Text style={{ fontSize: fonts.edition, fontWeight: 700 }}>{review}</Text> : null}
      <Text style={{ fontSize: fonts.small, color: PALETTE.inkSoft, marginTop: fonts.small * 0.4 }}>
        {`Dates in ${tz} time. Printed on ${PAPERS[snapshot.paper].label} ${snapshot.orientation}, to be read from ${loc(snapshot.readingDistanceM.toFixed(1))} m.`}
      </Text>
      {(snapshot.ruleExceptions ?? []).map((e, i) => (
        <Text key={`x${i}`} style={{ fontSize: fonts.small, lineHeight: 1.3, marginTop: fonts.small * 0.3 }}>
          {localiseNumbers(exceptionLine(e), input.lab?.numberFormat ?? "point", [e.reason, e.recordedBy ?? ""])}
        </Text>
      ))}
      {snapshot.notes ? (
        <Text style={{ fontSize: fonts.small, lineHeight: 1.3, marginTop: fonts.small * 0.4 }}>
          <Text style={{ fontWeight: 700 }}>Notes: </Text>
          {snapshot.notes}
        </Text>
      ) : null}
    </View>
  );
}

export function PosterDocument({ input }: { input: PosterInput }) {
  const { snapshot, edition } = input;
  const { grids, layout, legend, qr } = posterModel(input);
  const { fonts, page, scale } = layout;
  const nf = input.lab?.numberFormat ?? "point";
  const banner = statusBanner(edition.status);
  const created = edition.approvedAt ?? POSTER_EPOCH;
  const rule = Math.max(0.5, 0.6 * scale);

  return (
    <Document
      title={snapshot.title}
      author={snapshot.lab.name}
      subject={`Edition ${edition.number}`}
      keywords={`bifurcation, balloon sizing, ${lawName(snapshot.law)}, edition ${edition.number}, ${edition.shortCode ?? shortFingerprint(edition.fingerprint)}`}
      creator="Forkwall"
      producer="Forkwall"
      language="en"
      creationDate={created}
      modificationDate={created}
    >
      <Page
        wrap={false}
        size={[page.width, page.height]}
        style={{ fontFamily: POSTER_FONT, color: PALETTE.ink, backgroundColor: PALETTE.cell, minHeight: page.height }}
      >
        <Header input={input} layout={layout} />
        {banner && layout.banner ? (
          <View style={{ ...at(layout.banner), backgroundColor: PALETTE.banner, justifyContent: "center" }}>
            <Text style={{ fontSize: fonts.banner, fontWeight: 700, color: PALETTE.bannerText, textAlign: "center" }}>
              {banner}
            </Text>
          </View>
        ) : null}

        <CellGraphicsSvg
          cells={drawnCells(grids, layout, legend)}
          rule={rule}
          hatchWidth={Math.max(0.5, layout.figurePt * 0.03)}
        />
        {grids.map((grid, i) => (
          <GridTexts
            key={i}
            grid={grid}
            g={layout.grids[i] as GridLayout}
            layout={layout}
            sub={gridSubtitleParts(
              { kind: grid.kind, rounding: grid.rounding, family: snapshot.lookups[i]?.family ?? null },
              snapshot.stent?.name ?? null,
              true,
            )}
            nf={nf}
            typed={[snapshot.lookups[i]?.family?.name ?? "", snapshot.stent?.name ?? ""]}
          />
        ))}

        <Caution layout={layout} caution={snapshot.caution} />

        <Legend layout={layout} entries={legend} nf={nf} />

        <EditionBlock input={input} layout={layout} />

        <Qr layout={layout} url={edition.codeUrl ?? edition.checkUrl} code={edition.shortCode ?? null} qr={qr} />
      </Page>
    </Document>
  );
}
