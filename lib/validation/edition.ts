import { z } from "zod";
import { freeText } from "./text";

export const rejectEditionSchema = z
  .object({
    reason: freeText({
      what: "Reason",
      min: 3,
      max: 500,
      multiline: true,
      minMessage: "Say why, in a few words",
      maxMessage: "Keep the reason under 500 characters",
    }),
  })
  .strict();

export const withdrawEditionSchema = z
  .object({
    reason: freeText({
      what: "Reason",
      min: 3,
      max: 500,
      multiline: true,
      minMessage: "Say why it is withdrawn, in a few words",
      maxMessage: "Keep the reason under 500 characters",
    }),
  })
  .strict();

/** Ids in URLs: anything that is not a positive integer cannot name a row. */
export const idParam = z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER);

/** Approval is a statement: the approver says they reviewed the edition. */
export const approveEditionSchema = z
  .object({
    reviewed: z.literal(true, { error: "Confirm that you reviewed this edition (reviewed: true)" }),
  })
  .strict();
