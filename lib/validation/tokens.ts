import { z } from "zod";
import { freeText } from "./text";

/** What a machine token may do: read the lab's stock (GET), change it (every stock write). */
export const TOKEN_SCOPES = ["stock:read", "stock:write"] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];

export const TOKEN_NAME_MAX = 80;

export const createTokenSchema = z
  .object({
    name: freeText({ what: "Token name", min: 1, max: TOKEN_NAME_MAX }),
    scopes: z
      .array(z.enum(TOKEN_SCOPES, { error: 'Each scope must be "stock:read" or "stock:write".' }), {
        error: 'Scopes must be a list such as ["stock:read", "stock:write"].',
      })
      .min(1, "Choose at least one scope.")
      .transform((list) => TOKEN_SCOPES.filter((s) => list.includes(s))),
  })
  .strict();

export type CreateTokenInput = z.infer<typeof createTokenSchema>;
