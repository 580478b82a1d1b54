// From a frozen snapshot to what the layout and the legend need: used by the poster, and by the
// designer page to show legibility before anything is rendered.
import type { Snapshot } from "@/lib/charts/snapshot";
import { DEFAULT_ROUNDING_CAPS, LAWS } from "@/lib/sizing";
import { gridSubtitle, lookupTitle, statusBanner, shortUrl } from "./labels";
import type { EditionStatus } from "@/lib/editions/states";
import type { LayoutInput } from "./layout";
import { posterLegibility, type Legibility } from "./legibility";
import { legendEntries, type LegendEntry } from "./marks";

export function posterLegend(snapshot: Snapshot): LegendEntry[] {
  return legendEntries({
    law: snapshot.law,
    stentName: snapshot.stent?.name ?? null,
    hasProximal: snapshot.lookups.some((l) => l.kind === "proximal"),
    hasReach: snapshot.lookups.some((l) => l.rounding === "reach"),
    caps: snapshot.caps ?? DEFAULT_ROUNDING_CAPS,
  });
}

/** A typical printed check URL length, for layouts made before an edition exists. */
const TYPICAL_URL_CHARS = 40;

type EditionLike = { status: EditionStatus; checkUrl?: string };

/** The layout's input for a snapshot; a logo is assumed when the snapshot records one. */
export function layoutInputFor(
  snapshot: Snapshot,
  edition: EditionLike = { status: "draft" },
  hasLogo = snapshot.logoSha256 !== null,
): LayoutInput {
  return {
    paper: snapshot.paper,
    orientation: snapshot.orientation,
    grids: snapshot.lookups.map((l) => ({
      rows: l.rows.length,
      cols: l.cols.length,
      pressureLine: l.rounding === "reach",
      titleChars: lookupTitle(l.kind).length,
      subtitleChars: gridSubtitle(l, snapshot.stent?.name ?? null).length,
    })),
    texts: {
      title: snapshot.title.length,
      source: LAWS[snapshot.law.law].source.length,
      notes: snapshot.notes.length,
      caution: snapshot.caution.length,
      legend: posterLegend(snapshot).map((e) => e.label.length + e.text.length + 2),
      url: edition.checkUrl ? shortUrl(edition.checkUrl).length : TYPICAL_URL_CHARS,
    },
    banner: statusBanner(edition.status) !== null,
    logo: hasLogo,
  };
}

/** Whether the chart's figures can be read at its stated reading distance, with advice if not. */
export function snapshotLegibility(snapshot: Snapshot, edition?: EditionLike): Legibility {
  return posterLegibility({ ...layoutInputFor(snapshot, edition), readingDistanceM: snapshot.readingDistanceM });
}
