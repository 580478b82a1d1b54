// A server-action request whose body the framework cannot decode would end in a 500 inside it.
// This says, before that, whether the body is one the framework can read: the JSON text its
// client sends (text/plain) or a form (multipart). Other content types it already refuses.

export type PayloadCheck = { ok: true } | { ok: false; reason: string };

export const isActionRequest = (method: string, headers: Headers) =>
  method.toUpperCase() === "POST" && headers.has("next-action");

/** Checks a server action's body by its content type; `readForm` parses a multipart body. */
export async function checkActionPayload(
  contentType: string | null,
  text: () => Promise<string>,
  readForm: () => Promise<unknown>,
): Promise<PayloadCheck> {
  const type = (contentType ?? "").split(";")[0]!.trim().toLowerCase();
  if (type === "text/plain") {
    try {
      JSON.parse(await text());
      return { ok: true };
    } catch {
      return { ok: false, reason: "The form data could not be read (not the JSON a Forkwall page sends)." };
    }
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
