import { z } from "zod";

export const rejectEditionSchema = z
  .object({
    reason: z.string().trim().min(3, "Say why, in a few words").max(500, "Keep the reason under 500 characters"),
  })
  .strict();

export const withdrawEditionSchema = z
  .object({ reason: z.string().trim().max(500, "Keep the reason under 500 characters").optional() })
  .strict();

/** Ids in URLs: anything that is not a positive integer cannot name a row. */
export const idParam = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);
