import "server-only";
import { eq } from "drizzle-orm";
import { notFound } from "@/lib/errors";
import { labs } from "../schema";
import type { Tx } from "./audit";

/**
 * Writes to one lab run one at a time: every transaction that changes what the lab's charts
 * print, its postings or its members locks the lab row first, before any other read, so what
 * it reads next is what the previous writer committed (on any app instance).
 */
export async function lockLab(
  tx: Tx,
  labId: number,
): Promise<{ name: string; stockRevision: number; isDemo: boolean }> {
  const [row] = await tx
    .select({ name: labs.name, stockRevision: labs.stockRevision, isDemo: labs.isDemo })
    .from(labs)
    .where(eq(labs.id, labId))
    .for("update");
  if (!row) throw notFound("Lab");
  return row;
}
