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
  /** Set when its creator left the lab or stopped being a manager: refused until re-issued. */
  disabledAt: Date | null;
  disabledReason: string | null;
};

/** What a request's Bearer token stands for: an active token, its lab and scopes. */
export type TokenIdentity = { id: number; name: string; scopes: TokenScope[]; labId: number; labSlug: string };

/** The active (neither revoked nor disabled) token with this hash, with its lab; null when there is none. */
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
    .where(and(eq(labTokens.tokenHash, tokenHash), isNull(labTokens.revokedAt), isNull(labTokens.disabledAt)));
  // The column compares without regard to case; the hash must match exactly.
  if (!row || row.hash !== tokenHash) return null;
  return { id: row.id, name: row.name, labId: row.labId, labSlug: row.labSlug, scopes: row.scopes as TokenScope[] };
}

/** Notes the token's use (a single-row update outside any lab write). */
export async function touchToken({ tokenId }: { tokenId: number }): Promise<void> {
  await db.update(labTokens).set({ lastUsedAt: new Date() }).where(eq(labTokens.id, tokenId));
}

const viewColumns = {
  id: labTokens.id,
  name: labTokens.name,
  scopes: labTokens.scopes,
  hint: labTokens.hint,
  createdAt: labTokens.createdAt,
  createdByName: users.name,
  lastUsedAt: labTokens.lastUsedAt,
  disabledAt: labTokens.disabledAt,
  disabledReason: labTokens.disabledReason,
};

/**
 * The lab's tokens that are not revoked (disabled ones included), newest first; revoked ones are
 * kept only for the audit log's names.
 */
export async function listTokens({ labId }: { labId: number }): Promise<TokenView[]> {
  const rows = await db
    .select(viewColumns)
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
    disabledAt: null,
    disabledReason: null,
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

/**
 * Disables the lab's active tokens that `userId` created, each with an audit row naming why;
 * the caller's transaction holds the lab lock. Returns the tokens disabled.
 */
export async function disableTokensOf(
  tx: Tx,
  input: { labId: number; userId: number; reason: string; actorUserId: number },
): Promise<{ id: number; name: string }[]> {
  const active = and(
    eq(labTokens.labId, input.labId),
    eq(labTokens.createdBy, input.userId),
    isNull(labTokens.revokedAt),
    isNull(labTokens.disabledAt),
  );
  const rows = await tx.select({ id: labTokens.id, name: labTokens.name }).from(labTokens).where(active);
  if (rows.length === 0) return [];
  await tx.update(labTokens).set({ disabledAt: new Date(), disabledReason: input.reason }).where(active);
  for (const row of rows)
    await recordAudit({
      tx,
      labId: input.labId,
      actorUserId: input.actorUserId,
      action: "lab.token_disabled",
      targetType: "token",
      targetId: row.id,
      detail: { name: row.name, reason: input.reason },
    });
  return rows;
}

/** A token of the lab that is not revoked, locked for a change; null when there is none. */
export async function findTokenForUpdate(tx: Tx, { labId, tokenId }: { labId: number; tokenId: number }) {
  const [row] = await tx
    .select({ id: labTokens.id, name: labTokens.name, scopes: labTokens.scopes, disabledAt: labTokens.disabledAt })
    .from(labTokens)
    .where(and(eq(labTokens.labId, labId), eq(labTokens.id, tokenId), isNull(labTokens.revokedAt)))
    .for("update");
  return row ? { ...row, scopes: row.scopes as TokenScope[] } : null;
}

/**
 * Replaces a token by a new one with the same name and scopes and a new secret (the old row is
 * revoked, so the audit log keeps its name); audited as `lab.token_reissued`.
 */
export async function reissueToken(
  tx: Tx,
  input: {
    labId: number;
    old: { id: number; name: string; scopes: TokenScope[] };
    hash: string;
    hint: string;
    actor: Actor;
  },
): Promise<TokenView> {
  await tx
    .update(labTokens)
    .set({ revokedAt: new Date(), revokedBy: input.actor.id })
    .where(and(eq(labTokens.labId, input.labId), eq(labTokens.id, input.old.id)));
  const [row] = await tx
    .insert(labTokens)
    .values({
      labId: input.labId,
      name: input.old.name,
      scopes: input.old.scopes,
      tokenHash: input.hash,
      hint: input.hint,
      createdBy: input.actor.id,
    })
    .$returningId();
  await recordAudit({
    tx,
    labId: input.labId,
    actorUserId: input.actor.id,
    action: "lab.token_reissued",
    targetType: "token",
    targetId: row!.id,
    detail: { name: input.old.name, scopes: input.old.scopes, replaces: input.old.id },
  });
  const [created] = await tx
    .select(viewColumns)
    .from(labTokens)
    .leftJoin(users, eq(users.id, labTokens.createdBy))
    .where(eq(labTokens.id, row!.id));
  return { ...created!, scopes: created!.scopes as TokenScope[] };
}
