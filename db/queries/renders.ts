import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "../index";
import { labs, logos, posterRenders } from "../schema";

/** A stored render by the key over everything that decides its bytes. */
export async function findRender({ renderKey }: { renderKey: string }) {
  const [hit] = await db
    .select({ pdf: posterRenders.pdf })
    .from(posterRenders)
    .where(eq(posterRenders.renderKey, renderKey));
  return hit?.pdf ?? null;
}

/** Two instances may render at once; the first row wins and both bytes are identical. */
export async function storeRender({
  editionId,
  renderKey,
  pdf,
}: {
  editionId: number;
  renderKey: string;
  pdf: Buffer;
}) {
  await db.insert(posterRenders).values({ editionId, renderKey, pdf }).onDuplicateKeyUpdate({ set: { renderKey } });
}

export async function findLogoBytes({ labId, sha256 }: { labId: number; sha256: string }) {
  const [row] = await db
    .select({ bytes: logos.bytes, mime: logos.mime })
    .from(logos)
    .where(and(eq(logos.labId, labId), eq(logos.sha256, sha256)));
  return row ? { bytes: row.bytes, mime: row.mime as "image/png" | "image/jpeg" } : null;
}

/** What a poster prints from the lab itself rather than from the frozen snapshot. */
export async function findLabPrintSettings({ labId }: { labId: number }) {
  const [row] = await db
    .select({ timeZone: labs.timeZone, numberFormat: labs.numberFormat })
    .from(labs)
    .where(eq(labs.id, labId));
  return row ?? { timeZone: "UTC", numberFormat: "point" as const };
}
