import { z } from "zod";

/** Marks an id that cannot name a row; the operations layer answers it as "not found" (404), never 400. */
export const BAD_ID = "not-an-id";

/** The one id schema: a positive integer, from a path segment, a form field or JSON. */
export const idSchema = z.coerce
  .number({ error: BAD_ID })
  .int({ error: BAD_ID })
  .positive({ error: BAD_ID })
  .max(Number.MAX_SAFE_INTEGER, { error: BAD_ID });
