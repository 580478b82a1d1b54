import { z } from "zod";

/** Keyset pages of a lab's audit log: `before` for older entries, `after` for newer. */
const cursor = z.coerce
  .number({ error: "Must be a number." })
  .int("Must be a whole number.")
  .positive("Must be a positive id.")
  .max(Number.MAX_SAFE_INTEGER, "Too large.");

export const auditQuerySchema = z.object({
  before: cursor.optional(),
  after: cursor.optional(),
  limit: z.coerce
    .number({ error: "Must be a number." })
    .int("Must be a whole number.")
    .min(1, "At least 1.")
    .max(200, "At most 200.")
    .default(50),
});
