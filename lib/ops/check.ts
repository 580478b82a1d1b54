import "server-only";
import { readCheckRows } from "@/db/queries/check";
import { checkView, type CheckView } from "@/lib/editions/verdict";

export type { CheckView };

/** Everything the public check page shows for one QR token, or null when no edition has it. */
export async function getCheckByToken({ token, now = new Date() }: { token: string; now?: Date }) {
  const rows = await readCheckRows({ token });
  return rows ? checkView(rows, now) : null;
}
