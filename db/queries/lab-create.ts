import "server-only";
import { eq } from "drizzle-orm";
import { labs, memberships } from "../schema";
import { recordAudit, type Tx } from "./audit";

/** Whether a slug is taken (exactly, or by the column's case- and pad-folding collation). */
export async function slugTaken(tx: Tx, { slug }: { slug: string }): Promise<boolean> {
  const [row] = await tx.select({ id: labs.id }).from(labs).where(eq(labs.slug, slug));
  return Boolean(row);
}

/**
 * A new, empty lab; with `managerUserId` its creator becomes its first manager (the operator's
 * command instead invites the manager, who joins through the link).
 */
export async function createLab(
  tx: Tx,
  input: { name: string; slug: string; managerUserId: number | null; actorUserId: number | null; via: "web" | "cli" },
) {
  const [row] = await tx.insert(labs).values({ name: input.name, slug: input.slug }).$returningId();
  const labId = row!.id;
  if (input.managerUserId !== null)
    await tx.insert(memberships).values({ labId, userId: input.managerUserId, role: "manager" });
  await recordAudit({
    tx,
    labId,
    actorUserId: input.actorUserId,
    action: "lab.created",
    targetType: "lab",
    targetId: labId,
    detail: { name: input.name, slug: input.slug, via: input.via },
  });
  return { id: labId, name: input.name, slug: input.slug };
}
