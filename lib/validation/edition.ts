import { z } from "zod";
import { freeText } from "./text";

/** A reason a person gives for sending back or withdrawing an edition. */
const reasonSchema = (minMessage: string) =>
  z
    .object({
      reason: freeText({
        what: "Reason",
        min: 3,
        max: 500,
        multiline: true,
        minMessage,
        maxMessage: "Keep the reason under 500 characters",
      }),
    })
    .strict();

export const rejectEditionSchema = reasonSchema("Say why, in a few words");
export const withdrawEditionSchema = reasonSchema("Say why it is withdrawn, in a few words");

/** Approval is a statement: the approver says they reviewed the edition. */
export const approveEditionSchema = z
  .object({
    reviewed: z.literal(true, { error: "Confirm that you reviewed this edition (reviewed: true)" }),
  })
  .strict();
