import type { ReactNode } from "react";
import { Document, Page, Path, Rect, Svg, Text, View } from "@react-pdf/renderer";
import { snapshotGrids } from "@/lib/charts/snapshot";
import {
  CARD_HEAD_LINES,
  cardCoverage,
  cardFaces,
  cardGrid,
  cardKeyLines,
  layoutCard,
  layoutCardKey,
  CARD_PAGE,
  type CardFace,
  type CardLayout,
} from "@/lib/poster/card";
import type { Box } from "@/lib/poster/layout";
import { posterLegend } from "@/lib/poster/model";
import { cardExceptionLine } from "@/lib/poster/exceptions";
import { gridTextRuns } from "@/lib/poster/cell-text";
import {
  approvalText,
  formatDate,
  localiseNumbers,
  lookupTitle,
  reviewText,
  statusBanner,
  VESSEL_SYMBOLS,
} from "@/lib/poster/labels";
import { cellView, MARKS, MARK_ORDER, PALETTE, type MarkId } from "@/lib/poster/marks";
import { qrPath, qrSymbol, QR_QUIET_MODULES } from "@/lib/poster/qr";
import { lawFormula, lawName, type Grid } from "@/lib/sizing";
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

/** One short sentence per mark for the key face (the poster's legend says more). */
const KEY_SENTENCES: Record<MarkId, string> = {
  noSize: "These diameters form no bifurcation under this law.",
  noStock: "▲ above the largest or ▼ below the smallest stocked balloon (○ none in stock).",
  hazard: "The POT balloon could overstretch the main-branch stent: orange, heavy border.",
  oversize: "Further above the exact diameter than the lab's cap: choose with care.",
  undersize: "Further below the exact diameter than the lab's cap: choose with care.",
  outsideFit: "The law was fitted mainly to other bifurcation shapes: read with care.",
  nearRbp: "! The pressure is within the lab's headroom below rated burst pressure: check the balloon's own chart.",
};

const KEY_WORDS: Record<MarkId, string> = {
  noSize: "no size",
  noStock: "no stocked size",
  hazard: "stent limit",
  oversize: "above cap",
  undersize: "below cap",
  outsideFit: "outside fit",
  nearRbp: "near RBP",
};

/** The edition's lines: its number, the approval (or that it is a draft) and the review-by date. */
function editionLines(input: PosterInput): string[] {
  const tz = input.lab?.timeZone ?? "UTC";
  const { edition } = input;
  const review = edition.status === "approved" ? reviewText(edition.reviewBy, tz) : null;
  const approved =
    edition.status !== "draft" && edition.status !== "returned" && edition.approvedAt
      ? `Approved ${formatDate(edition.approvedAt, tz)}`
      : approvalText(edition, tz);
  return [`Edition ${edition.number}`, approved, ...(review ? [review] : [])];
}

function CardPage({ input, children }: { input: PosterInput; children: ReactNode }) {
  const banner = statusBanner(input.edition.status);
  return (
    <Page
      wrap={false}
      size={[CARD_PAGE.width, CARD_PAGE.height]}
      style={{
        fontFamily: POSTER_FONT,
        color: PALETTE.ink,
        backgroundColor: PALETTE.cell,
        minHeight: CARD_PAGE.height,
      }}
    >
      {banner ? (
        <View
          style={{
            position: "absolute",
            left: 0,
            top: 0,
            width: CARD_PAGE.width,
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
      {children}
      <Caution box={layoutCardKey().caution} caution={input.snapshot.caution} />
    </Page>
  );
}

function Caution({ box, caution }: { box: Box; caution: string }) {
  return (
    <View
      style={{
        ...at(box),
        backgroundColor: PALETTE.caution,
        borderWidth: 0.5,
        borderColor: PALETTE.cautionBorder,
        padding: 1.2,
      }}
    >
      <Text style={{ fontSize: 3.9, lineHeight: 1.15 }}>
        <Text style={{ fontWeight: 700 }}>CAUTION. </Text>
        {caution}
      </Text>
    </View>
  );
}

function QrCode({ box, url }: { box: Box; url: string }) {
  const qr = qrSymbol(url);
  const n = qr.size + 2 * QR_QUIET_MODULES;
  return (
    <Svg style={at(box)} width={box.width} height={box.height} viewBox={`0 0 ${n} ${n}`}>
      <Rect x={0} y={0} width={n} height={n} fill="#ffffff" />
      <Path d={qrPath(qr)} fill="#000000" />
    </Svg>
  );
}

/** A face with one lookup: the grid as far as it is legible at 40 cm, what it covers, the code and the dates. */
function GridFace({ input, full, grid, l }: { input: PosterInput; full: Grid; grid: Grid; l: CardLayout }) {
  const { edition } = input;
  const nf = input.lab?.numberFormat ?? "point";
  const loc = (t: string) => localiseNumbers(t, nf);
  const f = l.figurePt;
  const g = l.grid;
  const head = f * 0.56;
  const used = MARK_ORDER.filter((m) => grid.cells.some((row) => row.some((c) => cellView(c).marks.includes(m))));
  const key = l.exact ? "Large: balloon, mm; small: exact" : "Balloon, mm (exact diameters on the poster)";
  return (
    <CardPage input={input}>
      <View style={at(l.head)}>
        <Text style={{ ...CARD_HEAD_LINES.title, fontWeight: 700 }}>{lookupTitle(grid.kind)}</Text>
        <Text style={CARD_HEAD_LINES.detail}>{loc(`Shows ${cardCoverage(full, grid)}`)}</Text>
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
      <TextLayer runs={gridTextRuns(grid, l.grid, f, head, nf, l.exact)} />
      <QrCode box={l.qr} url={edition.checkUrl} />
      <View style={{ ...at({ ...l.code, height: l.key.y - l.code.y }), alignItems: "center" }}>
        <Text style={{ fontSize: 6.5, fontWeight: 700, textAlign: "center", ...TNUM }}>{edition.shortCode ?? ""}</Text>
        <Text style={{ fontSize: 3.6, textAlign: "center" }}>scan or type to check</Text>
        {editionLines(input).map((line, i) => (
          <Text key={i} style={{ fontSize: 4.2, fontWeight: i === 0 ? 700 : 400, textAlign: "center", marginTop: 0.8 }}>
            {line}
          </Text>
        ))}
      </View>
      <Text style={{ ...at(l.key), fontSize: 4.4, lineHeight: 1.1 }}>
        {loc([key, ...used.map((m) => `${MARKS[m].symbol} ${KEY_WORDS[m]}`)].join(" · "))}
        {(input.snapshot.ruleExceptions ?? [])
          .map((e) => `\n${localiseNumbers(cardExceptionLine(e), nf, [e.reason])}`)
          .join("")}
      </Text>
    </CardPage>
  );
}

/** The key face of a one-lookup card: chart, law, legend of the marks, what the front covers, dates, QR code. */
function KeyFace({ input, front }: { input: PosterInput; front: { full: Grid; grid: Grid } | null }) {
  const { snapshot, edition } = input;
  const nf = input.lab?.numberFormat ?? "point";
  const loc = (t: string) => localiseNumbers(t, nf);
  const l = layoutCardKey();
  const legend = posterLegend(snapshot);
  return (
    <CardPage input={input}>
      <View style={at(l.head)}>
        <Text style={{ ...CARD_HEAD_LINES.title, fontWeight: 700 }}>{snapshot.title}</Text>
        <Text style={CARD_HEAD_LINES.detail}>{loc(`${lawName(snapshot.law)}: ${lawFormula(snapshot.law)}`)}</Text>
      </View>
      <View style={at(l.body)}>
        {legend.map((e) => (
          <Text key={e.mark} style={{ fontSize: 4.2, lineHeight: 1.15, marginBottom: 0.8 }}>
            <Text style={{ fontWeight: 700 }}>{`${e.label}. `}</Text>
            {loc(e.mark === "sized" ? "Large: the stocked balloon, mm." : KEY_SENTENCES[e.mark])}
          </Text>
        ))}
        {front ? (
          <Text style={{ fontSize: 4.2, lineHeight: 1.15, marginTop: 0.8 }}>
            {loc(`The other side shows ${cardCoverage(front.full, front.grid)}.`)}
          </Text>
        ) : null}
        {(snapshot.ruleExceptions ?? []).map((e, i) => (
          <Text key={`x${i}`} style={{ fontSize: 4.2, lineHeight: 1.15, marginTop: 0.8 }}>
            {localiseNumbers(cardExceptionLine(e), nf, [e.reason])}
          </Text>
        ))}
      </View>
      <QrCode box={l.qr} url={edition.checkUrl} />
      <View style={{ ...at(l.code), alignItems: "center" }}>
        <Text style={{ fontSize: 6.5, fontWeight: 700, textAlign: "center", ...TNUM }}>{edition.shortCode ?? ""}</Text>
        <Text style={{ fontSize: 3.6, textAlign: "center" }}>scan or type to check</Text>
        {editionLines(input).map((line, i) => (
          <Text key={i} style={{ fontSize: 4.4, fontWeight: i === 0 ? 700 : 400, textAlign: "center", marginTop: 0.8 }}>
            {line}
          </Text>
        ))}
      </View>
    </CardPage>
  );
}

/** Two pages, front and back, each one lookup narrowed to what is legible at arm's length. */
export function CardDocument({ input }: { input: PosterInput }) {
  const { snapshot, edition } = input;
  const grids = snapshotGrids(snapshot);
  const keyLines = cardKeyLines(snapshot);
  const created = edition.approvedAt ?? POSTER_EPOCH;
  const faces = cardFaces(snapshot);
  const gridOf = (face: CardFace) => {
    if (face === "key") return null;
    const full = grids[face.lookup] ?? (grids[0] as Grid);
    return { full, grid: cardGrid(full, face, keyLines) };
  };
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
      {faces.map((face, i) => {
        if (face === "key") return <KeyFace key={i} input={input} front={gridOf(faces[0])} />;
        const { full, grid } = gridOf(face) as { full: Grid; grid: Grid };
        return <GridFace key={i} input={input} full={full} grid={grid} l={layoutCard(grid, keyLines)} />;
      })}
    </Document>
  );
}
