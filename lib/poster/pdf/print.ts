// One printed PDF of an edition, as it is downloaded: the poster, its tiled set or the badge
// card, with the stamp its state calls for. lib/ops/renders.ts caches what this returns.
import { posterKeepWhole } from "../seams";
import type { TileSheet } from "../tiles";
import { posterModel, type PosterInput } from "./document";
import { renderCardPdf, renderPosterPdf } from "./render";
import { stampBands, tilePoster, type Band, type TileOptions } from "./variants";

export type PrintOptions = {
  format: "poster" | "card";
  tiles?: TileSheet | null;
  band: Band | null;
  /** What the tiled sheets and their assembly map print beside the poster. */
  sheetLabels: Omit<TileOptions, "sheet" | "band" | "keepWhole">;
};

export async function printEdition(input: PosterInput, opts: PrintOptions): Promise<Buffer> {
  if (opts.format === "card") {
    const card = await renderCardPdf(input);
    return opts.band ? stampBands(card, opts.band) : card;
  }
  const poster = await renderPosterPdf(input);
  if (opts.tiles) {
    const { layout, grids } = posterModel(input);
    const keepWhole = posterKeepWhole(layout, grids);
    return tilePoster(poster, { ...opts.sheetLabels, sheet: opts.tiles, band: opts.band, keepWhole });
  }
  return opts.band ? stampBands(poster, opts.band) : poster;
}

/** The stamp an edition's state calls for, or null for a current approved edition. */
export function bandFor(
  state: "draft" | "returned" | "approved" | "current" | "outdated" | "superseded" | "withdrawn",
  today: string,
): Band | null {
  if (state === "draft" || state === "returned") return { kind: "unapproved", state };
  if (state === "outdated" || state === "superseded" || state === "withdrawn")
    return { kind: "not-current", date: today, reason: NOT_CURRENT_REASON[state], state };
  return null;
}

const NOT_CURRENT_REASON = {
  outdated: "the lab's stock or rules changed since this edition was approved",
  superseded: "a newer edition replaces this one",
  withdrawn: "this edition was withdrawn",
} as const;
