import { Document, Page, Path, Rect, Svg, Text, View } from "@react-pdf/renderer";
import { snapshotGrids } from "@/lib/charts/snapshot";
import { CARD_HEAD_LINES, cardGrid, cardKeyLines, cardSides, layoutCard, type CardLayout } from "@/lib/poster/card";
import { cardExceptionLine } from "@/lib/poster/exceptions";
import { gridTextRuns } from "@/lib/poster/cell-text";
import { localiseNumbers, lookupTitle, statusBanner, VESSEL_SYMBOLS } from "@/lib/poster/labels";
import { cellView, MARKS, MARK_ORDER, PALETTE, type MarkId } from "@/lib/poster/marks";
import { qrPath, qrSymbol, QR_QUIET_MODULES } from "@/lib/poster/qr";
import { lawName, type Grid } from "@/lib/sizing";
import {
  at,
  CellGraphicsSvg,
  TextLayer,
  gridCells,
  POSTER_EPOCH,
  POSTER_FONT,
  TNUM,
  type PosterInput,
} from "./document";

const KEY_WORDS: Record<MarkId, string> = {
  noSize: "no size",
  noStock: "no stocked size",
  hazard: "stent limit",
  oversize: "above cap",
  undersize: "below cap",
  outsideFit: "outside fit",
  nearRbp: "near RBP",
};

function Side({ input, grid, l }: { input: PosterInput; grid: Grid; l: CardLayout }) {
  const { snapshot, edition } = input;
  const nf = input.lab?.numberFormat ?? "point";
  const loc = (t: string) => localiseNumbers(t, nf);
  const f = l.figurePt;
  const g = l.grid;
  const head = f * 0.56;
  const qr = qrSymbol(edition.checkUrl);
  const n = qr.size + 2 * QR_QUIET_MODULES;
  const used = MARK_ORDER.filter((m) => grid.cells.some((row) => row.some((c) => cellView(c).marks.includes(m))));
  const banner = statusBanner(edition.status);
  return (
    <Page
      wrap={false}
      size={[l.page.width, l.page.height]}
      style={{ fontFamily: POSTER_FONT, color: PALETTE.ink, backgroundColor: PALETTE.cell, minHeight: l.page.height }}
    >
      {banner ? (
        <View
          style={{
            position: "absolute",
            left: 0,
            top: 0,
            width: l.page.width,
            height: 12,
            backgroundColor: PALETTE.banner,
            justifyContent: "center",
          }}
        >
          <Text style={{ fontSize: 5.5, fontWeight: 700, color: PALETTE.bannerText, textAlign: "center" }}>
            {banner}
          </Text>
        </View>
      ) : null}
      <View style={at(l.head)}>
        <Text style={{ ...CARD_HEAD_LINES.title, fontWeight: 700 }}>{lookupTitle(grid.kind)}</Text>
        <Text style={CARD_HEAD_LINES.detail}>
          {localiseNumbers(`${lawName(snapshot.law)} · ${snapshot.title} · edition ${edition.number}`, nf, [
            snapshot.title,
          ])}
        </Text>
      </View>
      <CellGraphicsSvg cells={gridCells(grid, l.grid)} rule={0.4} hatchWidth={0.4} />
      <Text
        style={{
          position: "absolute",
          left: g.cellsX - g.rowHeadWidth,
          width: g.rowHeadWidth - 1,
          top: g.cellsY - g.colHeadHeight + 0.5,
          fontSize: head * 0.45,
          fontWeight: 700,
          textAlign: "right",
        }}
      >{`${VESSEL_SYMBOLS[grid.colAxis.vessel]} →`}</Text>
      <Text
        style={{
          position: "absolute",
          left: g.cellsX - g.rowHeadWidth + 1,
          top: g.cellsY - head * 0.45 * 1.2 - 0.5,
          fontSize: head * 0.45,
          fontWeight: 700,
        }}
      >{`${VESSEL_SYMBOLS[grid.rowAxis.vessel]} ↓`}</Text>
      <TextLayer runs={gridTextRuns(grid, l.grid, f, head, nf)} />
      <Svg style={at(l.qr)} width={l.qr.width} height={l.qr.height} viewBox={`0 0 ${n} ${n}`}>
        <Rect x={0} y={0} width={n} height={n} fill="#ffffff" />
        <Path d={qrPath(qr)} fill="#000000" />
      </Svg>
      <View style={{ ...at(l.code), alignItems: "center" }}>
        <Text style={{ fontSize: 6.5, fontWeight: 700, textAlign: "center", ...TNUM }}>{edition.shortCode ?? ""}</Text>
        <Text style={{ fontSize: 3.6, textAlign: "center" }}>scan or type to check</Text>
      </View>
      <Text style={{ ...at(l.key), fontSize: 4.4, lineHeight: 1.1 }}>
        {loc(
          ["Large: balloon, mm; small: exact", ...used.map((m) => `${MARKS[m].symbol} ${KEY_WORDS[m]}`)].join(" · "),
        )}
        {(snapshot.ruleExceptions ?? []).map((e) => `\n${cardExceptionLine(e)}`).join("")}
      </Text>
      <View
        style={{
          ...at(l.caution),
          backgroundColor: PALETTE.caution,
          borderWidth: 0.5,
          borderColor: PALETTE.cautionBorder,
          padding: 1.2,
        }}
      >
        <Text style={{ fontSize: 3.9, lineHeight: 1.15 }}>
          <Text style={{ fontWeight: 700 }}>CAUTION. </Text>
          {snapshot.caution}
        </Text>
      </View>
    </Page>
  );
}

/** Two pages, front and back, each one lookup narrowed to what is legible at arm's length. */
export function CardDocument({ input }: { input: PosterInput }) {
  const { snapshot, edition } = input;
  const grids = snapshotGrids(snapshot);
  const keyLines = cardKeyLines(snapshot);
  const created = edition.approvedAt ?? POSTER_EPOCH;
  return (
    <Document
      title={`${snapshot.title} (badge card)`}
      author={snapshot.lab.name}
      subject={`Edition ${edition.number}`}
      keywords={`badge card, edition ${edition.number}, ${edition.shortCode ?? ""}`}
      creator="Forkwall"
      producer="Forkwall"
      language="en"
      creationDate={created}
      modificationDate={created}
    >
      {cardSides(snapshot).map((side, i) => {
        const full = grids[side.lookup] ?? (grids[0] as Grid);
        const grid = cardGrid(full, side, keyLines);
        return <Side key={i} input={input} grid={grid} l={layoutCard(grid, keyLines)} />;
      })}
    </Document>
  );
}
