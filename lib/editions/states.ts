export const EDITION_STATUSES = ["draft", "approved", "superseded", "withdrawn"] as const;
export type EditionStatus = (typeof EDITION_STATUSES)[number];

// Forward-only lifecycle; drizzle/0001_edition_immutability.sql enforces the same table.
const NEXT: Record<EditionStatus, readonly EditionStatus[]> = {
  draft: ["approved", "withdrawn"],
  approved: ["superseded", "withdrawn"],
  superseded: ["withdrawn"],
  withdrawn: [],
};

export function canTransition(from: EditionStatus, to: EditionStatus): boolean {
  return NEXT[from].includes(to);
}
