import { z } from "zod";
import { AUDIT_KIND_IDS } from "@/lib/audit/describe";

/** Keyset pages of a lab's audit log: `before` for older entries, `after` for newer. */
const cursor = z.coerce
  .number({ error: "Must be a number." })
  .int("Must be a whole number.")
  .positive("Must be a positive id.")
  .max(Number.MAX_SAFE_INTEGER, "Too large.");

// A filter left at "any" in the page's form arrives as an empty string: no filter.
const blankAsNone = (v: unknown) => (v === "" ? undefined : v);

const calendarDate = z
  .string({ error: "Give a date as YYYY-MM-DD." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Give a date as YYYY-MM-DD.")
  .refine(
    (s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
    {
      error: "No such date.",
    },
  );

export const auditQuerySchema = z
  .object({
    before: cursor.optional(),
    after: cursor.optional(),
    limit: z.coerce
      .number({ error: "Must be a number." })
      .int("Must be a whole number.")
      .min(1, "At least 1.")
      .max(200, "At most 200.")
      .default(50),
    kind: z.preprocess(
      blankAsNone,
      z.enum(AUDIT_KIND_IDS, { error: `Kind must be one of ${AUDIT_KIND_IDS.join(", ")}.` }).optional(),
    ),
    actor: z.preprocess(blankAsNone, cursor.optional()),
    from: z.preprocess(blankAsNone, calendarDate.optional()),
    to: z.preprocess(blankAsNone, calendarDate.optional()),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, {
    error: "The first date must not be after the last.",
    path: ["to"],
  });

export type AuditQuery = z.infer<typeof auditQuerySchema>;
