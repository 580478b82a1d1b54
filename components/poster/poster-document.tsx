import path from "node:path";
import { Document, Font, Image, Line, Page, Path, Rect, Svg, Text, View } from "@react-pdf/renderer";
import type { Style } from "@react-pdf/stylesheet";
import { snapshotGrids, type Snapshot } from "@/lib/charts/snapshot";
import { shortFingerprint } from "@/lib/charts/fingerprint";
import type { EditionStatus } from "@/lib/editions/states";
import { lawFormula, lawName, LAWS, type Grid } from "@/lib/sizing";
import {
  approvalText,
  axisTitles,
  ROLE_SYMBOLS,
  DRAFT_WATERMARK,
  gridSubtitle,
  lookupTitle,
  shortUrl,
  statusBanner,
} from "@/lib/poster/labels";
import { cellBox, CELL, layoutPoster, type Box, type GridLayout, type PosterLayout } from "@/lib/poster/layout";
import { legibilityLine, posterLegibility } from "@/lib/poster/legibility";
import { cellView, cornerSymbols, formatAxisMm, MARKS, PALETTE, type CellView, type LegendEntry, type MarkId } from "@/lib/poster/marks";
import { layoutInputFor, posterLegend } from "@/lib/poster/model";
import { PAPERS } from "@/lib/poster/paper";
import { qrPath, qrSymbol, QR_QUIET_MODULES } from "@/lib/poster/qr";

export type PosterInput = {
  snapshot: Snapshot;
  edition: {
    number: number;
    status: EditionStatus;
    approvedAt: Date | null;
    approvedByName: string | null;
    fingerprint: string;
    checkUrl: string;
  };
  logo: { bytes: Buffer; mime: "image/png" | "image/jpeg" } | null;
};

export const POSTER_FONT = "Inter";
let fontsRegistered = false;

/** Registers Inter from fonts/ (absolute paths) and turns hyphenation off; safe to call often. */
export function registerPosterFonts(): void {
  if (fontsRegistered) return;
  const file = (name: string) => path.join(process.cwd(), "fonts", name);
  Font.register({
    family: POSTER_FONT,
    fonts: [
      { src: file("Inter-Regular.ttf"), fontWeight: 400 },
      { src: file("Inter-SemiBold.ttf"), fontWeight: 600 },
      { src: file("Inter-Bold.ttf"), fontWeight: 700 },
    ],
  });
  Font.registerHyphenationCallback((word) => [word]);
  fontsRegistered = true;
}

const TNUM: Style = { fontFeatureSettings: ["tnum"] };
const at = (b: Box): Style => ({ position: "absolute", left: b.x, top: b.y, width: b.width, height: b.height });

/** Everything the document needs, computed once from the input (pure). */
export function posterModel(input: PosterInput) {
  const { snapshot, edition } = input;
  const grids = snapshotGrids(snapshot);
  const layoutInput = layoutInputFor(snapshot, edition);
  const layout = layoutPoster(layoutInput);
  const legibility = posterLegibility({ ...layoutInput, readingDistanceM: snapshot.readingDistanceM });
  return { grids, layout, legibility, legend: posterLegend(snapshot), qr: qrSymbol(edition.checkUrl) };
}

function Hatch({ width, height, strokeWidth }: { width: number; height: number; strokeWidth: number }) {
  const step = Math.max(height, width) / 5;
  if (!(step > 0)) return null;
  const lines = [];
  for (let k = -height; k < width; k += step) {
    lines.push(<Line key={k} x1={k} y1={height} x2={k + height} y2={0} stroke={PALETTE.hatch} strokeWidth={strokeWidth} />);
  }
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${width} ${height}`} style={{ position: "absolute", left: 0, top: 0 }}>
      {lines}
    </Svg>
  );
}

/** One cell drawn from its view; also used, smaller, for the legend's swatches. */
function CellBlock({ view, box, f, pressureLine, rule }: { view: CellView; box: Box; f: number; pressureLine: boolean; rule: number }) {
  const small = f * CELL.smallRatio;
  const inset = view.border * Math.min(box.width, box.height);
  const pad = f * 0.1 + inset;
  const corner = cornerSymbols(view);
  return (
    <View style={{ ...at(box), backgroundColor: view.background, borderRightWidth: rule, borderBottomWidth: rule, borderColor: PALETTE.rule }}>
      {view.hatch ? <Hatch width={box.width - rule} height={box.height - rule} strokeWidth={Math.max(0.4, f * 0.03)} /> : null}
      {view.exact ? (
        <Text style={{ position: "absolute", left: pad, top: f * 0.06 + inset * 0.6, fontSize: small, lineHeight: 1, color: PALETTE.ink, ...TNUM }}>{view.exact}</Text>
      ) : null}
      {corner ? (
        <Text style={{ position: "absolute", right: pad, top: f * 0.05 + inset * 0.6, fontSize: small * 1.1, lineHeight: 1, fontWeight: 700, color: PALETTE.ink }}>{corner}</Text>
      ) : null}
      <Text
        style={{
          position: "absolute",
          left: 0,
          width: box.width - rule,
          top: f * CELL.figureTopEm,
          fontSize: f,
          lineHeight: 1,
          fontWeight: 700,
          textAlign: "center",
          color: PALETTE.ink,
          ...TNUM,
        }}
      >
        {view.primary}
      </Text>
      {pressureLine && view.pressure ? (
        <Text style={{ position: "absolute", left: 0, width: box.width - rule, top: f * (CELL.figureTopEm + 1.02), fontSize: small, lineHeight: 1, fontWeight: 600, textAlign: "center", color: PALETTE.ink, ...TNUM }}>
          {view.pressure}
        </Text>
      ) : null}
      {view.border > 0 ? (
        <View
          style={{
            position: "absolute",
            left: 0,
            top: 0,
            width: box.width - rule,
            height: box.height - rule,
            borderWidth: view.border * Math.min(box.width, box.height),
            borderColor: PALETTE.ink,
          }}
        />
      ) : null}
    </View>
  );
}

function GridBlock({ grid, g, f, layout, sub, pressureLine }: { grid: Grid; g: GridLayout; f: number; layout: PosterLayout; sub: string; pressureLine: boolean }) {
  const { fonts, scale } = layout;
  const titles = axisTitles(grid);
  const head = f * CELL.headingRatio;
  const rule = Math.max(0.5, 0.6 * scale);
  const rows = grid.rowAxis.values;
  const cols = grid.colAxis.values;
  const rowAxisPt = Math.min(fonts.axis, g.rowAxis.height / ((titles.rows.length + 2) * 0.6));
  const rowAxisCenter = { x: g.rowAxis.x + g.rowAxis.width / 2, y: g.rowAxis.y + g.rowAxis.height / 2 };
  const corner: Box = { x: g.cellsX - g.rowHeadWidth, y: g.cellsY - g.colHeadHeight, width: g.rowHeadWidth, height: g.colHeadHeight };
  return (
    <>
      <View style={at(g.title)}>
        <Text style={{ fontSize: fonts.gridTitle, fontWeight: 700, lineHeight: 1.25, color: PALETTE.ink }}>{lookupTitle(grid.kind)}</Text>
        <Text style={{ fontSize: fonts.gridSub, lineHeight: 1.25, color: PALETTE.inkSoft }}>{sub}</Text>
      </View>
      <Text style={{ ...at(g.colAxis), fontSize: fonts.axis, fontWeight: 600, textAlign: "center", paddingTop: fonts.axis * 0.2, color: PALETTE.ink }}>{`${titles.cols} →`}</Text>
      <View
        style={{
          position: "absolute",
          left: rowAxisCenter.x - g.rowAxis.height / 2,
          top: rowAxisCenter.y - g.rowAxis.width / 2,
          width: g.rowAxis.height,
          height: g.rowAxis.width,
          transform: "rotate(-90deg)",
        }}
      >
        <Text style={{ fontSize: rowAxisPt, fontWeight: 600, textAlign: "center", paddingTop: fonts.axis * 0.2, color: PALETTE.ink }}>{`${titles.rows} ←`}</Text>
      </View>
      <View style={{ ...at(corner), backgroundColor: PALETTE.heading, borderWidth: rule, borderColor: PALETTE.rule }}>
        <Text style={{ position: "absolute", right: f * 0.08, top: f * 0.04, fontSize: head * 0.5, fontWeight: 600, color: PALETTE.ink }}>{`${ROLE_SYMBOLS[grid.colAxis.role]} →`}</Text>
        <Text style={{ position: "absolute", left: f * 0.08, bottom: f * 0.04, fontSize: head * 0.5, fontWeight: 600, color: PALETTE.ink }}>{`${ROLE_SYMBOLS[grid.rowAxis.role]} ↓`}</Text>
      </View>
      {cols.map((c, j) => (
        <View
          key={`c${j}`}
          style={{
            ...at({ x: g.cellsX + j * g.cellWidth, y: g.cellsY - g.colHeadHeight, width: g.cellWidth, height: g.colHeadHeight }),
            backgroundColor: PALETTE.heading,
            borderTopWidth: rule,
            borderRightWidth: rule,
            borderBottomWidth: rule,
            borderColor: PALETTE.rule,
            justifyContent: "center",
          }}
        >
          <Text style={{ fontSize: head, fontWeight: 700, lineHeight: 1, textAlign: "center", color: PALETTE.ink, ...TNUM }}>{formatAxisMm(c)}</Text>
        </View>
      ))}
      {rows.map((r, i) => (
        <View
          key={`r${i}`}
          style={{
            ...at({ x: g.cellsX - g.rowHeadWidth, y: g.cellsY + i * g.cellHeight, width: g.rowHeadWidth, height: g.cellHeight }),
            backgroundColor: PALETTE.heading,
            borderLeftWidth: rule,
            borderRightWidth: rule,
            borderBottomWidth: rule,
            borderColor: PALETTE.rule,
            justifyContent: "center",
          }}
        >
          <Text style={{ fontSize: head, fontWeight: 700, lineHeight: 1, textAlign: "center", color: PALETTE.ink, ...TNUM }}>{formatAxisMm(r)}</Text>
        </View>
      ))}
      {grid.cells.map((row, i) =>
        row.map((cell, j) => <CellBlock key={`${i}-${j}`} view={cellView(cell)} box={cellBox(g, i, j)} f={f} pressureLine={pressureLine} rule={rule} />),
      )}
    </>
  );
}

function Swatch({ mark, box, f }: { mark: MarkId | "sized"; box: Box; f: number }) {
  const def = mark === "sized" ? null : MARKS[mark];
  const view: CellView = {
    primary: mark === "sized" ? "3.0" : mark === "noStock" ? "▲" : mark === "noSize" ? "—" : "3.5",
    primaryIsSize: true,
    pressure: null,
    exact: mark === "noSize" ? null : "(3.42)",
    marks: def ? [def.id] : [],
    background: def?.background ?? PALETTE.cell,
    hatch: def?.hatch ?? false,
    border: def?.border ?? 0,
    description: "",
  };
  return (
    <View style={{ ...at(box), borderTopWidth: 0.5, borderLeftWidth: 0.5, borderColor: PALETTE.rule }}>
      <CellBlock view={view} box={{ x: 0, y: 0, width: box.width, height: box.height }} f={f} pressureLine={false} rule={0.5} />
    </View>
  );
}

function Legend({ layout, entries }: { layout: PosterLayout; entries: LegendEntry[] }) {
  const { fonts, legend } = layout;
  return (
    <>
      <Text style={{ position: "absolute", left: legend.x, top: legend.y, width: legend.width, fontSize: fonts.legend * 1.2, fontWeight: 700, color: PALETTE.ink }}>
        How to read a cell
      </Text>
      {entries.map((e, i) => {
        const row = layout.legendRows[i];
        if (!row) return null;
        return (
          <View key={e.mark}>
            <Swatch mark={e.mark} box={row.swatch} f={row.swatch.height / CELL.heightEm} />
            <Text style={{ position: "absolute", left: row.text.x, top: row.text.y, width: row.text.width, fontSize: fonts.legend, lineHeight: 1.25, color: PALETTE.ink }}>
              <Text style={{ fontWeight: 700 }}>{`${e.label}. `}</Text>
              {e.text}
            </Text>
          </View>
        );
      })}
    </>
  );
}

function Qr({ layout, input, qr }: { layout: PosterLayout; input: PosterInput; qr: ReturnType<typeof qrSymbol> }) {
  const n = qr.size + 2 * QR_QUIET_MODULES;
  const { fonts } = layout;
  return (
    <>
      <Svg style={at(layout.qr)} width={layout.qr.width} height={layout.qr.height} viewBox={`0 0 ${n} ${n}`}>
        <Rect x={0} y={0} width={n} height={n} fill="#ffffff" />
        <Path d={qrPath(qr)} fill="#000000" />
      </Svg>
      <View style={{ ...at(layout.qrText), alignItems: "center" }}>
        <Text style={{ fontSize: fonts.small * 1.1, fontWeight: 700, textAlign: "center", color: PALETTE.ink }}>{shortUrl(input.edition.checkUrl)}</Text>
        <Text style={{ fontSize: fonts.small, textAlign: "center", color: PALETTE.inkSoft, marginTop: fonts.small * 0.3 }}>
          Scan or type to check this poster is still the current edition
        </Text>
      </View>
    </>
  );
}

export function PosterDocument({ input }: { input: PosterInput }) {
  const { snapshot, edition, logo } = input;
  const { grids, layout, legibility, legend, qr } = posterModel(input);
  const { fonts, page, header, scale } = layout;
  const banner = statusBanner(edition.status);
  const created = edition.approvedAt ?? POSTER_EPOCH;
  const logoW = logo ? header.height * 2 : 0;
  const diagonal = Math.hypot(page.width, page.height);
  const watermarkPt = (diagonal * 0.7) / 13.6;
  const angle = (Math.atan2(page.height, page.width) * 180) / Math.PI;

  return (
    <Document
      title={snapshot.title}
      author={snapshot.lab.name}
      subject={`Edition ${edition.number}`}
      keywords={`bifurcation, balloon sizing, ${lawName(snapshot.law)}, edition ${edition.number}, ${shortFingerprint(edition.fingerprint)}`}
      creator="Forkwall"
      producer="Forkwall"
      language="en"
      creationDate={created}
      modificationDate={created}
    >
      <Page size={[page.width, page.height]} style={{ fontFamily: POSTER_FONT, color: PALETTE.ink, backgroundColor: "#ffffff" }}>
        {logo ? (
          // eslint-disable-next-line jsx-a11y/alt-text -- react-pdf's Image has no alt; the lab name is printed beside it
          <Image
            src={{ data: logo.bytes, format: logo.mime === "image/png" ? "png" : "jpg" }}
            style={{ position: "absolute", left: header.x, top: header.y, width: logoW, height: header.height, objectFit: "contain", objectPosition: "left" }}
          />
        ) : null}
        <View style={{ position: "absolute", left: header.x + (logo ? logoW + 10 * scale : 0), top: header.y, width: header.width - layout.law.width - logoW - 20 * scale }}>
          <Text style={{ fontSize: fonts.lab, fontWeight: 600, color: PALETTE.inkSoft }}>{snapshot.lab.name}</Text>
          <Text style={{ fontSize: fonts.title, fontWeight: 700, lineHeight: 1.15 }}>{snapshot.title}</Text>
        </View>
        <View style={at(layout.law)}>
          <Text style={{ fontSize: fonts.law, fontWeight: 700, textAlign: "right" }}>{`Law: ${lawName(snapshot.law)}`}</Text>
          <Text style={{ fontSize: fonts.law, fontWeight: 600, textAlign: "right", ...TNUM }}>{lawFormula(snapshot.law)}</Text>
          <Text style={{ fontSize: fonts.source, textAlign: "right", color: PALETTE.inkSoft, marginTop: 2 * scale }}>{LAWS[snapshot.law.law].source}</Text>
        </View>

        {banner && layout.banner ? (
          <View style={{ ...at(layout.banner), backgroundColor: PALETTE.banner, justifyContent: "center" }}>
            <Text style={{ fontSize: fonts.banner, fontWeight: 700, color: PALETTE.bannerText, textAlign: "center" }}>{banner}</Text>
          </View>
        ) : null}

        {grids.map((grid, i) => {
          const lookup = snapshot.lookups[i];
          const g = layout.grids[i] as GridLayout;
          const sub = gridSubtitle({ kind: grid.kind, rounding: grid.rounding, family: lookup?.family ?? null }, snapshot.stent?.name ?? null);
          return <GridBlock key={i} grid={grid} g={g} f={layout.figurePt} layout={layout} sub={sub} pressureLine={grid.rounding === "reach"} />;
        })}

        <View style={{ ...at(layout.caution), backgroundColor: PALETTE.caution, borderWidth: 1.5 * scale, borderColor: PALETTE.cautionBorder, padding: 6 * scale - 1.5 * scale }}>
          <Text style={{ fontSize: fonts.caution, lineHeight: 1.3, color: PALETTE.ink }}>
            <Text style={{ fontWeight: 700 }}>CAUTION. </Text>
            {snapshot.caution}
          </Text>
        </View>

        <Legend layout={layout} entries={legend} />

        <View style={at(layout.edition)}>
          <Text style={{ fontSize: fonts.edition * 1.6, fontWeight: 700 }}>{`Edition ${edition.number}`}</Text>
          <Text style={{ fontSize: fonts.edition, fontWeight: edition.status === "approved" ? 600 : 700, marginTop: fonts.edition * 0.2 }}>
            {approvalText(edition)}
          </Text>
          <Text style={{ fontSize: fonts.edition, ...TNUM }}>{`Fingerprint ${shortFingerprint(edition.fingerprint)}`}</Text>
          <Text style={{ fontSize: fonts.small, color: PALETTE.inkSoft, marginTop: fonts.small * 0.4 }}>
            {`${PAPERS[snapshot.paper].label} ${snapshot.orientation}. ${legibilityLine(legibility, snapshot.readingDistanceM)}.`}
          </Text>
          {snapshot.notes ? (
            <Text style={{ fontSize: fonts.small, lineHeight: 1.3, marginTop: fonts.small * 0.4 }}>
              <Text style={{ fontWeight: 700 }}>Notes: </Text>
              {snapshot.notes}
            </Text>
          ) : null}
        </View>

        <Qr layout={layout} input={input} qr={qr} />

        {edition.status === "draft" ? (
          <View
            style={{
              position: "absolute",
              left: page.width / 2 - diagonal / 2,
              top: page.height / 2 - watermarkPt * 0.7,
              width: diagonal,
              height: watermarkPt * 1.4,
              transform: `rotate(-${angle}deg)`,
              justifyContent: "center",
            }}
          >
            <Text style={{ fontSize: watermarkPt, fontWeight: 700, color: PALETTE.watermark, opacity: 0.16, textAlign: "center" }}>{DRAFT_WATERMARK}</Text>
          </View>
        ) : null}
      </Page>
    </Document>
  );
}

/** Metadata date of editions that carry no approval date: fixed, so drafts render byte-identically. */
export const POSTER_EPOCH = new Date(Date.UTC(2000, 0, 1));
