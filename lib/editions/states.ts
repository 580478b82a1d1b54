export const EDITION_STATUSES = ["draft", "approved", "superseded", "withdrawn", "returned"] as const;
export type EditionStatus = (typeof EDITION_STATUSES)[number];

// Forward-only lifecycle; drizzle/0001_edition_immutability.sql enforces the same table.
// A draft sent back is `returned`: it keeps the reason and can never be approved; the author
// makes a new edition instead.
const NEXT: Record<EditionStatus, readonly EditionStatus[]> = {
  draft: ["approved", "returned", "withdrawn"],
  approved: ["superseded", "withdrawn"],
  superseded: ["withdrawn"],
  withdrawn: [],
  returned: [],
};

export function canTransition(from: EditionStatus, to: EditionStatus): boolean {
  return NEXT[from].includes(to);
}
