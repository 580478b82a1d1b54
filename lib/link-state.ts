// Where a single-use e-mailed link stands; pure, so the query layer and the pages share it.
export type LinkState = "valid" | "expired" | "used" | "revoked";

export function linkState(
  row: { expiresAt: Date; usedAt?: Date | null; revokedAt?: Date | null },
  now = new Date(),
): LinkState {
  if (row.usedAt) return "used";
  if (row.revokedAt) return "revoked";
  if (row.expiresAt.getTime() <= now.getTime()) return "expired";
  return "valid";
}
