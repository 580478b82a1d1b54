// A server-action request whose body the framework cannot decode would end in a 500 inside it.
// This says, before that, whether the body is one the framework can read: the JSON text its
// client sends (text/plain) or a form (multipart). Other content types it already refuses.

export type PayloadCheck = { ok: true } | { ok: false; reason: string };

export const isActionRequest = (method: string, headers: Headers) =>
  method.toUpperCase() === "POST" && headers.has("next-action");

// In the JSON form, "$" strings that stand for values ("$$" is an escaped "$") are fine; any other
// "$" string points at another part of a multipart body, which a text body cannot have.
const PLAIN_VALUE = /^\$(?:\$|undefined$|NaN$|-?Infinity$|-0$|D|n-?\d)/;

function hasReference(value: unknown, depth = 0): boolean {
  if (typeof value === "string") return value.startsWith("$") && !PLAIN_VALUE.test(value);
  if (typeof value !== "object" || value === null || depth > 50) return depth > 50;
  return Object.values(value).some((v) => hasReference(v, depth + 1));
}

/**
 * The framework refuses a server action whose Origin names another host than the request's
 * (with a 500); this tells the same thing first, so the refusal can be a 403.
 */
export function sameHostOrigin(headers: Headers): boolean {
  const origin = headers.get("origin");
  if (origin === null) return true;
  const host = headers.get("x-forwarded-host")?.split(",")[0]?.trim() || headers.get("host");
  try {
    return new URL(origin).host === host;
  } catch {
    return false;
  }
}

/** Checks a server action's body by its content type; `readForm` parses a multipart body. */
export async function checkActionPayload(
  contentType: string | null,
  text: () => Promise<string>,
  readForm: () => Promise<unknown>,
): Promise<PayloadCheck> {
  const type = (contentType ?? "").split(";")[0]!.trim().toLowerCase();
  if (type === "text/plain") {
    let args: unknown;
    try {
      args = JSON.parse(await text());
    } catch {
      return { ok: false, reason: "The form data could not be read (not the JSON a Forkwall page sends)." };
    }
    if (!Array.isArray(args))
      return { ok: false, reason: "The form data could not be read (not a list of arguments)." };
    if (hasReference(args))
      return { ok: false, reason: "The form data could not be read (it refers to parts that were not sent)." };
    return { ok: true };
  }
  if (type === "multipart/form-data") {
    try {
      await readForm();
      return { ok: true };
    } catch {
      return { ok: false, reason: "The form data could not be read (a broken multipart body)." };
    }
  }
  return { ok: true };
}
