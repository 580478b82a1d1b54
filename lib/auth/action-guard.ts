import "server-only";
import type { z } from "zod";
import { AppError } from "@/lib/errors";
import type { Capability } from "@/lib/permissions";
import { requireMember, type Member } from "./guard";

/** What every form server action returns: field errors and the values entered, so nothing is lost. */
export type ActionState = {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string>;
  values?: Record<string, unknown>;
  /** The id of what the action created, when it created something. */
  id?: number;
};

export function formValues(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of form.entries()) if (typeof value === "string") out[key] = value;
  return out;
}

/**
 * The server-action twin of labRoute: resolves the member and capability on the server,
 * parses input with the same zod schema as the API, and reports failures as form state.
 */
export async function memberAction<S extends z.ZodType>(
  slug: string,
  capability: Capability,
  schema: S,
  input: unknown,
  fn: (member: Member, data: z.infer<S>) => Promise<ActionState>,
): Promise<ActionState> {
  const values = input instanceof FormData ? formValues(input) : (input as Record<string, unknown>);
  try {
    const member = await requireMember({ slug }, capability);
    const parsed = schema.safeParse(values);
    if (!parsed.success) {
      const fieldErrors: Record<string, string> = {};
      for (const issue of parsed.error.issues) fieldErrors[issue.path.join(".") || "_"] ??= issue.message;
      return { ok: false, message: "Please correct the highlighted fields.", fieldErrors, values };
    }
    return await fn(member, parsed.data);
  } catch (err) {
    if (err instanceof AppError) {
      const fieldErrors = err.issues
        ? Object.fromEntries(err.issues.map((i) => [i.path.join(".") || "_", i.message]))
        : undefined;
      return { ok: false, message: err.message, fieldErrors, values };
    }
    throw err;
  }
}
