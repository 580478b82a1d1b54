"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { changeMemberRole, inviteMember, removeMember, resendInvitation, revokeInvitation } from "@/lib/ops/members";
import { ROLE_LABELS } from "@/lib/permissions";

// Every form names its lab in a hidden field `slug`; the operation checks the caller's role there.
const refresh = (slug: unknown) => revalidatePath(`/labs/${String(slug)}/members`);
const MAIL_FAILED = " The e-mail could not be sent; try Resend in a moment.";

export async function inviteMemberAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, email, role }) => {
    const { invitation, emailSent } = await inviteMember(caller, { lab: String(slug) }, { email, role });
    refresh(slug);
    const who = `${invitation.email} as ${ROLE_LABELS[invitation.role].toLowerCase()}`;
    return {
      ok: emailSent,
      message: `Invitation for ${who} saved.${emailSent ? " The e-mail is on its way." : MAIL_FAILED}`,
    };
  });
}

export async function resendInvitationAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, invitationId }) => {
    const { invitation, emailSent } = await resendInvitation(caller, { lab: String(slug), invitationId });
    refresh(slug);
    const message = emailSent
      ? `A new link was sent to ${invitation.email}; the previous one no longer works.`
      : `New link saved.${MAIL_FAILED}`;
    return { ok: emailSent, message };
  });
}

export async function revokeInvitationAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (caller, { slug, invitationId }) => {
    const revoked = await revokeInvitation(caller, { lab: String(slug), invitationId });
    refresh(slug);
    return { ok: true, message: `The invitation to ${revoked.email} was revoked; its link no longer works.` };
  });
}

export async function changeMemberRoleAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  let selfDemoted: string | null = null;
  const state = await runAction(payload, async (caller, { slug, membershipId, role }) => {
    const changed = await changeMemberRole(caller, { lab: String(slug), membershipId }, { role });
    const self = caller.kind === "user" && changed.userId === caller.user.id;
    if (changed.changed && self && role !== "manager") selfDemoted = String(slug);
    refresh(slug);
    const label = ROLE_LABELS[changed.role].toLowerCase();
    return {
      ok: true,
      message: changed.changed ? `${changed.name} is now ${label}.` : `${changed.name} already has that role.`,
    };
  });
  if (selfDemoted) redirect(`/labs/${selfDemoted}`);
  return state;
}

export async function removeMemberAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  let removedSelf = false;
  const state = await runAction(payload, async (caller, { slug, membershipId }) => {
    const removed = await removeMember(caller, { lab: String(slug), membershipId });
    removedSelf = caller.kind === "user" && removed.userId === caller.user.id;
    refresh(slug);
    return { ok: true, message: `${removed.name} was removed from the lab.` };
  });
  if (removedSelf) redirect("/dashboard");
  return state;
}
