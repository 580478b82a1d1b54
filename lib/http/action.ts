import "server-only";
import { AppError, invalidInput } from "@/lib/errors";
import { sessionCaller, type Caller } from "@/lib/ops/caller";
import { log } from "@/lib/log";
import { illFormedText } from "@/lib/validation/well-formed";
import { payloadTooLarge, type UploadedFile } from "@/lib/upload";
import { toAppError } from "./respond";

/** What every server action returns: field errors and the values entered, so nothing is lost. */
export type ActionState = {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string>;
  values?: Record<string, unknown>;
  /** The id of what the action created, when it created something. */
  id?: number;
  /** Every reason in order, for lists that are not form fields (e.g. a CSV file's bad lines). */
  issues?: string[];
  /** A result the caller shows, e.g. the plan of a CSV import preview. */
  data?: unknown;
};

/** The one signature of every server action: React's form-action shape, refs inside the payload. */
export type ServerAction = (prev: ActionState, payload: ActionPayload) => Promise<ActionState>;

export type ActionPayload = FormData | Record<string, unknown>;

export function formValues(payload: ActionPayload): Record<string, unknown> {
  if (!(payload instanceof FormData))
    return typeof payload === "object" && payload !== null && !Array.isArray(payload) ? payload : {};
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
  // A hand-made request may send any JSON in place of the form: not a form, nothing to run.
  if (!(payload instanceof FormData) && (typeof payload !== "object" || payload === null || Array.isArray(payload)))
    return { ok: false, message: "The form data could not be read. Reload the page and try again." };
  const values = formValues(payload);
  const keep = Object.fromEntries(Object.entries(values).filter(([k]) => !(opts.secret ?? []).includes(k)));
  try {
    // Checked before any write: a broken character found after a commit would fail the answer.
    const broken = illFormedText(payload);
    if (broken)
      throw invalidInput([{ path: broken, message: "Contains a broken character (a lone UTF-16 surrogate)." }]);
    return await fn(await sessionCaller(), values);
  } catch (err) {
    const known = toAppError(err);
    if (!known) throw err;
    if (known.status >= 500) log.error({ err }, known.message);
    if (!known.issues?.length) return { ok: false, message: known.message, values: keep };
    const fieldErrors: Record<string, string> = {};
    for (const i of known.issues) fieldErrors[i.path.join(".") || "_"] ??= i.message;
    // A message that only lists the fields' reasons gives way to a pointer at the fields.
    const listsFields = known.code === "invalid_input" && known.message === invalidInput(known.issues).message;
    const message = listsFields ? "Please correct the highlighted fields." : known.message;
    return { ok: false, message, fieldErrors, issues: known.issues.map((i) => i.message), values: keep };
  }
}

/**
 * The file a form sent in `field`, refused above `maxBytes` from its declared size before its
 * bytes are read (the request body itself is capped by `serverActions.bodySizeLimit`).
 */
export async function uploadedFile(
  payload: ActionPayload,
  { field = "file", maxBytes, tooLargeHint }: { field?: string; maxBytes: number; tooLargeHint: string },
): Promise<UploadedFile> {
  const file = payload instanceof FormData ? payload.get(field) : payload[field];
  if (!(file instanceof File) || file.size === 0)
    throw new AppError("invalid_input", "Choose a file to send.", [{ path: [field], message: "No file was sent." }]);
  if (file.size > maxBytes) throw payloadTooLarge(file.size, maxBytes, tooLargeHint);
  return { name: file.name.slice(0, 200), bytes: new Uint8Array(await file.arrayBuffer()) };
}
