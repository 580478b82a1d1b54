// From a frozen snapshot to what the layout and the legend need: used by the poster, and by the
// designer page to show legibility before anything is rendered.
import { lookupCaps, snapshotGrids, type Snapshot } from "@/lib/charts/snapshot";
import { lawCitation, lawFormula, lawName, type Grid } from "@/lib/sizing";
import { gridSubtitleParts, lookupTitle, statusBanner } from "./labels";
import type { EditionStatus } from "@/lib/editions/states";
import { exceptionLine } from "./exceptions";
import type { LayoutInput } from "./layout";
import { CARD_READING_DISTANCE_M } from "./card";
import { posterLegibility, requiredHeightMm, type Legibility } from "./legibility";
import { cellView, legendEntries, type CellView, type LegendEntry, type MarkId } from "./marks";

/**
 * The first cell of the chart that shows `mark`, as printed; for "sized", a stocked balloon with
 * no mark if there is one, else one whose only marks sit in the corner.
 */
function sampleCell(grids: readonly Grid[], mark: MarkId | "sized"): CellView | undefined {
  const views = grids.flatMap((g) => g.cells.flatMap((row) => row.map(cellView)));
  if (mark !== "sized") return views.find((v) => v.marks.includes(mark));
  const sized = views.filter((v) => v.primaryIsSize && !v.marks.includes("noStock") && !v.marks.includes("hazard"));
  return sized.find((v) => v.marks.length === 0) ?? sized[0];
}

const CAP_NAMES = { proximal: "POT", side: "side branch", main: "main branch" } as const;

/** Legend lines for the marks this chart's grids use, each with a real cell of the chart as its sample. */
export function posterLegend(snapshot: Snapshot, grids: readonly Grid[] = snapshotGrids(snapshot)): LegendEntry[] {
  const all = legendEntries({
    law: snapshot.law,
    stentName: snapshot.stent?.name ?? null,
    hasProximal: snapshot.lookups.some((l) => l.kind === "proximal"),
    hasReach: snapshot.lookups.some((l) => l.rounding === "reach"),
    caps: snapshot.lookups[0] ? lookupCaps(snapshot, snapshot.lookups[0]) : snapshot.caps,
    headroomAtm: grids.find((g) => g.rounding === "reach")?.headroomAtm,
    capsByLookup: snapshot.lookups.map((l) => ({ name: CAP_NAMES[l.kind], caps: lookupCaps(snapshot, l) })),
  });
  return all.flatMap((e) => {
    const sample = sampleCell(grids, e.mark);
    return sample ? [{ ...e, sample }] : [];
  });
}

/** A typical printed short address (host, /c/ and the 9-character code), for layouts made before an edition exists. */
const TYPICAL_URL_CHARS = 34;

type EditionLike = { status: EditionStatus; codeUrl?: string; checkUrl?: string; reviewBy?: Date | null };

/** The law as printed in the header: its name and formula. */
export const lawHeading = (snapshot: Snapshot) => `${lawName(snapshot.law)}: ${lawFormula(snapshot.law)}`;

/** The layout's input for a snapshot; a logo is assumed when the snapshot records one. */
export function layoutInputFor(
  snapshot: Snapshot,
  edition: EditionLike = { status: "draft" },
  hasLogo = snapshot.logoSha256 !== null,
  grids: readonly Grid[] = snapshotGrids(snapshot),
): LayoutInput {
  const url = edition.codeUrl ?? edition.checkUrl;
  return {
    paper: snapshot.paper,
    orientation: snapshot.orientation,
    readingDistanceM: snapshot.readingDistanceM,
    grids: snapshot.lookups.map((l) => ({
      rows: l.rows.length,
      cols: l.cols.length,
      pressureLine: l.rounding === "reach",
      titleChars: lookupTitle(l.kind).length,
      subtitleLines: gridSubtitleParts(l, snapshot.stent?.name ?? null, true).map((p) => p.length),
    })),
    texts: {
      title: snapshot.title.length,
      law: lawHeading(snapshot).length,
      source: lawCitation(snapshot.law).length,
      notes: snapshot.notes.length,
      exceptions: (snapshot.ruleExceptions ?? []).map((e) => exceptionLine(e).length),
      caution: snapshot.caution.length,
      legend: posterLegend(snapshot, grids).map((e) => e.label.length + e.text.length + 2),
      url: url ? url.replace(/^https?:\/\//, "").length : TYPICAL_URL_CHARS,
    },
    banner: statusBanner(edition.status) !== null,
    logo: hasLogo,
  };
}

/** Whether the chart's figures can be read at its stated reading distance, with advice if not. */
export function snapshotLegibility(snapshot: Snapshot, edition?: EditionLike): Legibility {
  return posterLegibility({ ...layoutInputFor(snapshot, edition), readingDistanceM: snapshot.readingDistanceM });
}

/** The lab rule an edition whose figures are too small to read breaks, as refusals name it. */
export const LEGIBILITY_RULE = "legibility";

/**
 * The nearest an exception may bring the reader: arm's length, where the badge card is read. An
 * exception excuses the stated distance ("read at the table"), not figures nobody can read: on a
 * small sheet at a long distance the headings can leave the grid no room at all.
 */
export const EXCEPTION_FLOOR_M = CARD_READING_DISTANCE_M;

const mm1 = (x: number) => (Math.round(x * 10) / 10).toFixed(1);

/**
 * Why an edition cannot be approved for legibility, or null: its figures, as the approved poster
 * prints them, fall below the 20′ guide at its stated reading distance, and the medical lead
 * recorded no exception to the rule for this chart (snapshot.ruleExceptions); or, with an
 * exception, they fall below the guide even at EXCEPTION_FLOOR_M.
 */
export function legibilityRefusal(snapshot: Snapshot): string | null {
  const l = snapshotLegibility(snapshot, { status: "approved" });
  if (l.ok) return null;
  const rule = `Lab rule "${LEGIBILITY_RULE}"`;
  if (!(snapshot.ruleExceptions ?? []).some((e) => e.rule === LEGIBILITY_RULE))
    return `${rule}: the figures are too small to read from ${snapshot.readingDistanceM} m. ${l.suggestion ?? ""}`.trim();
  const floorMm = requiredHeightMm(EXCEPTION_FLOOR_M);
  if (l.figureHeightMm >= floorMm) return null;
  return `${rule}: the exception recorded for this chart excuses the reading distance, but these figures (${mm1(l.figureHeightMm)} mm high) cannot be read even from ${EXCEPTION_FLOOR_M} m, where they need ${mm1(floorMm)} mm. ${l.suggestion ?? ""}`.trim();
}
