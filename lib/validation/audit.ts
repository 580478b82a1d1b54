import { z } from "zod";
import { idField } from "./members";

/** Keyset pages of a lab's audit log: `before` for older entries, `after` for newer. */
export const auditQuerySchema = z.object({
  before: idField.optional(),
  after: idField.optional(),
  limit: z.coerce
    .number({ error: "Must be a number." })
    .int("Must be a whole number.")
    .min(1, "At least 1.")
    .max(200, "At most 200.")
    .default(50),
});
