"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { runAction, type ActionState } from "@/lib/http/action";
import { changeMemberRole, inviteMember, removeMember, resendInvitation, revokeInvitation } from "@/lib/ops/members";
import { ROLE_LABELS } from "@/lib/permissions";

// Every form names its lab in a hidden field; the operation checks the caller's role there.
const labOf = (form: FormData) => String(form.get("slug") ?? "");
const refresh = (slug: string) => revalidatePath(`/labs/${slug}/members`);
const MAIL_FAILED = " The e-mail could not be sent; try Resend in a moment.";

export async function inviteMemberAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(form, async (caller, { email, role }) => {
    const { invitation, emailSent } = await inviteMember(caller, { lab: labOf(form) }, { email, role });
    refresh(labOf(form));
    const who = `${invitation.email} as ${ROLE_LABELS[invitation.role].toLowerCase()}`;
    return {
      ok: emailSent,
      message: `Invitation for ${who} saved.${emailSent ? " The e-mail is on its way." : MAIL_FAILED}`,
    };
  });
}

export async function resendInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(form, async (caller, { invitationId }) => {
    const { invitation, emailSent } = await resendInvitation(caller, { lab: labOf(form), invitationId });
    refresh(labOf(form));
    const message = emailSent
      ? `A new link was sent to ${invitation.email}; the previous one no longer works.`
      : `New link saved.${MAIL_FAILED}`;
    return { ok: emailSent, message };
  });
}

export async function revokeInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(form, async (caller, { invitationId }) => {
    const revoked = await revokeInvitation(caller, { lab: labOf(form), invitationId });
    refresh(labOf(form));
    return { ok: true, message: `The invitation to ${revoked.email} was revoked; its link no longer works.` };
  });
}

export async function changeMemberRoleAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  let selfDemoted = false;
  const state = await runAction(form, async (caller, { membershipId, role }) => {
    const changed = await changeMemberRole(caller, { lab: labOf(form), membershipId }, { role });
    selfDemoted = changed.changed && caller.kind === "user" && changed.userId === caller.user.id && role !== "manager";
    refresh(labOf(form));
    const label = ROLE_LABELS[changed.role].toLowerCase();
    return {
      ok: true,
      message: changed.changed ? `${changed.name} is now ${label}.` : `${changed.name} already has that role.`,
    };
  });
  if (selfDemoted) redirect(`/labs/${labOf(form)}`);
  return state;
}

export async function removeMemberAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  let removedSelf = false;
  const state = await runAction(form, async (caller, { membershipId }) => {
    const removed = await removeMember(caller, { lab: labOf(form), membershipId });
    removedSelf = caller.kind === "user" && removed.userId === caller.user.id;
    refresh(labOf(form));
    return { ok: true, message: `${removed.name} was removed from the lab.` };
  });
  if (removedSelf) redirect("/dashboard");
  return state;
}
