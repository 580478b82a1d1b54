// What a stale-copy notice records: the copies a change made stale, by room, and why.
export type StaleItem = {
  room: string;
  chartId: number;
  chartTitle: string;
  editionNumber: number;
  status: "outdated" | "superseded" | "withdrawn";
  changes: string[];
  /** The approved edition to print instead, when there is one that differs from this copy. */
  current: { editionId: number; number: number } | null;
};

export type StaleNotice = {
  /** "all-clear": every copy of the lab is current again (rows from before digests have no kind: stale). */
  kind?: "stale" | "all-clear";
  labName: string;
  labSlug: string;
  cause: string;
  items: StaleItem[];
};
