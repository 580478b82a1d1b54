export const EDITION_STATUSES = ["draft", "approved", "superseded", "withdrawn"] as const;
export type EditionStatus = (typeof EDITION_STATUSES)[number];
