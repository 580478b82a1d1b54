import "server-only";
import { sessionCaller, type Caller } from "@/lib/ops/caller";
import { log } from "@/lib/log";
import { toAppError } from "./respond";

/** What every server action returns: field errors and the values entered, so nothing is lost. */
export type ActionState = {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string>;
  values?: Record<string, unknown>;
  /** The id of what the action created, when it created something. */
  id?: number;
};

export type ActionPayload = FormData | Record<string, unknown>;

export function formValues(payload: ActionPayload): Record<string, unknown> {
  if (!(payload instanceof FormData)) return payload;
  const out: Record<string, unknown> = {};
  for (const [key, value] of payload.entries()) if (typeof value === "string") out[key] = value;
  return out;
}

/**
 * The one server-action runner: builds the caller from the session, runs one operation and
 * reports any refusal as form state with each field's message and the values entered (secrets
 * left out). Navigation (redirect, notFound) passes through.
 */
export async function runAction(
  payload: ActionPayload,
  fn: (caller: Caller, values: Record<string, unknown>) => Promise<ActionState>,
  opts: { secret?: string[] } = {},
): Promise<ActionState> {
  const values = formValues(payload);
  const keep = Object.fromEntries(Object.entries(values).filter(([k]) => !(opts.secret ?? []).includes(k)));
  try {
    return await fn(await sessionCaller(), values);
  } catch (err) {
    const known = toAppError(err);
    if (!known) throw err;
    if (known.status >= 500) log.error({ err }, known.message);
    const fieldErrors = known.issues
      ? Object.fromEntries(known.issues.map((i) => [i.path.join(".") || "_", i.message]))
      : undefined;
    const message =
      fieldErrors && known.code === "invalid_input" ? "Please correct the highlighted fields." : known.message;
    return { ok: false, message, fieldErrors, values: keep };
  }
}
