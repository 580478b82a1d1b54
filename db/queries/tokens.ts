import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { AppError, notFound } from "@/lib/errors";
import type { TokenScope } from "@/lib/validation/tokens";
import { db } from "../index";
import { labs, labTokens, users } from "../schema";
import { recordAudit, type Actor, type Tx } from "./audit";

export type TokenView = {
  id: number;
  name: string;
  scopes: TokenScope[];
  hint: string;
  createdAt: Date;
  createdByName: string | null;
  lastUsedAt: Date | null;
};

/** What a request's Bearer token stands for: an active token, its lab and scopes. */
export type TokenIdentity = { id: number; name: string; scopes: TokenScope[]; labId: number; labSlug: string };

/** The active (not revoked) token with this hash, with its lab; null when there is none. */
export async function findActiveToken({ tokenHash }: { tokenHash: string }): Promise<TokenIdentity | null> {
  const [row] = await db
    .select({
      id: labTokens.id,
      name: labTokens.name,
      scopes: labTokens.scopes,
      labId: labTokens.labId,
      labSlug: labs.slug,
      hash: labTokens.tokenHash,
    })
    .from(labTokens)
    .innerJoin(labs, eq(labs.id, labTokens.labId))
    .where(and(eq(labTokens.tokenHash, tokenHash), isNull(labTokens.revokedAt)));
  // The column compares without regard to case; the hash must match exactly.
  if (!row || row.hash !== tokenHash) return null;
  return { id: row.id, name: row.name, labId: row.labId, labSlug: row.labSlug, scopes: row.scopes as TokenScope[] };
}

/** Notes the token's use (a single-row update outside any lab write). */
export async function touchToken({ tokenId }: { tokenId: number }): Promise<void> {
  await db.update(labTokens).set({ lastUsedAt: new Date() }).where(eq(labTokens.id, tokenId));
}

/** The lab's active tokens, newest first (revoked ones are kept only for the audit log's names). */
export async function listTokens({ labId }: { labId: number }): Promise<TokenView[]> {
  const rows = await db
    .select({
      id: labTokens.id,
      name: labTokens.name,
      scopes: labTokens.scopes,
      hint: labTokens.hint,
      createdAt: labTokens.createdAt,
      createdByName: users.name,
      lastUsedAt: labTokens.lastUsedAt,
    })
    .from(labTokens)
    .leftJoin(users, eq(users.id, labTokens.createdBy))
    .where(and(eq(labTokens.labId, labId), isNull(labTokens.revokedAt)))
    .orderBy(desc(labTokens.id));
  return rows.map((r) => ({ ...r, scopes: r.scopes as TokenScope[] }));
}

/** Stores a new token's hash; the caller holds the lab lock, so names of active tokens stay unique. */
export async function createToken(
  tx: Tx,
  input: { labId: number; name: string; scopes: TokenScope[]; hash: string; hint: string; actor: Actor },
): Promise<TokenView> {
  const [taken] = await tx
    .select({ id: labTokens.id })
    .from(labTokens)
    .where(and(eq(labTokens.labId, input.labId), eq(labTokens.name, input.name), isNull(labTokens.revokedAt)));
  if (taken) throw new AppError("conflict", `A token named "${input.name}" already exists in this lab.`);
  const [row] = await tx
    .insert(labTokens)
    .values({
      labId: input.labId,
      name: input.name,
      scopes: input.scopes,
      tokenHash: input.hash,
      hint: input.hint,
      createdBy: input.actor.id,
    })
    .$returningId();
  // The audit row names the token; never the token or its hash.
  await recordAudit({
    tx,
    labId: input.labId,
    actorUserId: input.actor.id,
    action: "lab.token_created",
    targetType: "token",
    targetId: row!.id,
    detail: { name: input.name, scopes: input.scopes },
  });
  const [created] = await tx
    .select({ createdAt: labTokens.createdAt })
    .from(labTokens)
    .where(eq(labTokens.id, row!.id));
  return {
    id: row!.id,
    name: input.name,
    scopes: input.scopes,
    hint: input.hint,
    createdAt: created!.createdAt,
    createdByName: input.actor.name,
    lastUsedAt: null,
  };
}

/** Revokes an active token of the lab; a revoked, foreign or unknown id is "not found". */
export async function revokeToken(tx: Tx, input: { labId: number; tokenId: number; actor: Actor }) {
  const [row] = await tx
    .select({ id: labTokens.id, name: labTokens.name })
    .from(labTokens)
    .where(and(eq(labTokens.labId, input.labId), eq(labTokens.id, input.tokenId), isNull(labTokens.revokedAt)));
  if (!row) throw notFound("Token");
  await tx
    .update(labTokens)
    .set({ revokedAt: new Date(), revokedBy: input.actor.id })
    .where(and(eq(labTokens.labId, input.labId), eq(labTokens.id, input.tokenId)));
  await recordAudit({
    tx,
    labId: input.labId,
    actorUserId: input.actor.id,
    action: "lab.token_revoked",
    targetType: "token",
    targetId: row.id,
    detail: { name: row.name },
  });
  return { id: row.id, name: row.name, revoked: true as const };
}
