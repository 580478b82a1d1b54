import "server-only";
import * as q from "@/db/queries/tokens";
import { newMachineToken } from "@/lib/auth/machine-tokens";
import { AppError, notFound } from "@/lib/errors";
import { createTokenSchema } from "@/lib/validation/tokens";
import { labOperation } from "./operation";
import { labWrite } from "./write";

// Machine tokens of a lab: managers create, list, revoke and re-issue them. The token is returned once,
// at creation; only its SHA-256 is stored.

export const listTokens = labOperation({
  name: "lab.tokens.list",
  capability: "tokens:manage",
  scope: "lab",
  run: async ({ labId }) => ({ tokens: await q.listTokens({ labId }) }),
});

/** A new token: `{ ...view, token }`, the token shown this once and never again. */
export const createToken = labOperation({
  name: "lab.tokens.create",
  capability: "tokens:manage",
  scope: "lab",
  input: createTokenSchema,
  run: async ({ labId, actor }, { name, scopes }) => {
    const { token, hash, hint } = newMachineToken();
    const view = await labWrite(labId, (tx) => q.createToken(tx, { labId, name, scopes, hash, hint, actor }));
    return { ...view, token };
  },
});

export const revokeToken = labOperation({
  name: "lab.tokens.revoke",
  capability: "tokens:manage",
  scope: "lab",
  ids: { tokenId: "Token" },
  run: ({ labId, actor, ids }) => labWrite(labId, (tx) => q.revokeToken(tx, { labId, tokenId: ids.tokenId, actor })),
});

/**
 * A disabled token (its creator left or stopped being a manager) gets a new secret with the same
 * name and scopes, shown once like a new token; the old secret stays refused. 409 for an active one.
 */
export const reissueToken = labOperation({
  name: "lab.tokens.reissue",
  capability: "tokens:manage",
  scope: "lab",
  ids: { tokenId: "Token" },
  run: async ({ labId, actor, ids }) => {
    const { token, hash, hint } = newMachineToken();
    const view = await labWrite(labId, async (tx) => {
      const old = await q.findTokenForUpdate(tx, { labId, tokenId: ids.tokenId });
      if (!old) throw notFound("Token");
      if (!old.disabledAt)
        throw new AppError(
          "conflict",
          `The token "${old.name}" is active; to change its secret, revoke it and create another.`,
        );
      return q.reissueToken(tx, { labId, old, hash, hint, actor });
    });
    return { ...view, token };
  },
});
