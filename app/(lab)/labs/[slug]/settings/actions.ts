"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { updateLabSettings } from "@/lib/ops/lab-settings";
import { createToken, reissueToken, revokeToken } from "@/lib/ops/tokens";

// Every form names its lab in a hidden field `slug`; the operation checks the caller's role there.

/** The lab's settings form (`slug`, `name`, `timeZone`, `numberFormat`, `contactLine`): managers only. */
export async function updateLabSettingsAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, name, timeZone, numberFormat, contactLine }) => {
    const { changed } = await updateLabSettings(
      caller,
      { lab: String(slug) },
      { name, timeZone, numberFormat, contactLine },
    );
    // The name shows in the lab's header and dates on every lab page follow the time zone.
    revalidatePath(`/labs/${String(slug)}`, "layout");
    return { ok: true, message: changed.length ? "Settings saved." : "Nothing changed." };
  });
}

/** A new machine token (`slug`, `name`, `scopes` one or more): the token comes back once, in `data.token`. */
export async function createTokenAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  // A form sends one `scopes` field per ticked box.
  const scopes =
    payload instanceof FormData ? payload.getAll("scopes") : (payload as { scopes?: unknown } | null)?.scopes;
  return runAction(payload, async (caller, { slug, name }) => {
    const created = await createToken(caller, { lab: String(slug) }, { name, scopes });
    revalidatePath(`/labs/${String(slug)}/settings`);
    return {
      ok: true,
      message: `Token "${created.name}" created. Copy it now: it is shown only this once.`,
      id: created.id,
      data: { token: created.token, name: created.name },
    };
  });
}

/** Revokes a token (`slug`, `tokenId`): requests with it answer 401 from now on. */
export async function revokeTokenAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, tokenId }) => {
    const revoked = await revokeToken(caller, { lab: String(slug), tokenId });
    revalidatePath(`/labs/${String(slug)}/settings`);
    return { ok: true, message: `Token "${revoked.name}" revoked: requests with it are refused from now on.` };
  });
}

/** Re-issues a disabled token (`slug`, `tokenId`): same name and scopes, a new secret in `data.token`, shown once. */
export async function reissueTokenAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, tokenId }) => {
    const issued = await reissueToken(caller, { lab: String(slug), tokenId });
    revalidatePath(`/labs/${String(slug)}/settings`);
    return {
      ok: true,
      message: `Token "${issued.name}" re-issued. Copy the new secret now: it is shown only this once.`,
      id: issued.id,
      data: { token: issued.token, name: issued.name },
    };
  });
}
