"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { revokeInvitation } from "@/db/queries/invitations";
import { changeMemberRole, removeMember } from "@/db/queries/members";
import { memberAction, type ActionState } from "@/lib/auth/action-guard";
import { inviteMember, resendInvitation } from "@/lib/auth/invitations";
import { ROLE_LABELS } from "@/lib/permissions";
import { invitationIdSchema, inviteSchema, memberIdSchema, memberRoleFormSchema } from "@/lib/validation/members";

// Every action names its lab in a hidden field; memberAction checks the caller's role there.
const slugOf = (form: FormData) => String(form.get("slug") ?? "");
const refresh = (slug: string) => revalidatePath(`/labs/${slug}/members`);
const mailNote = (sent: boolean) => (sent ? "" : " The e-mail could not be sent; try Resend in a moment.");

export async function inviteMemberAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  return memberAction(slug, "members:manage", inviteSchema, form, async (member, data) => {
    const { invitation, emailSent } = await inviteMember(member, data);
    refresh(slug);
    return {
      ok: emailSent,
      message: `Invitation for ${invitation.email} as ${ROLE_LABELS[invitation.role].toLowerCase()} saved.${emailSent ? " The e-mail is on its way." : mailNote(false)}`,
    };
  });
}

export async function resendInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  return memberAction(slug, "members:manage", invitationIdSchema, form, async (member, data) => {
    const { invitation, emailSent } = await resendInvitation(member, data.invitationId);
    refresh(slug);
    return {
      ok: emailSent,
      message: emailSent
        ? `A new link was sent to ${invitation.email}; the previous one no longer works.`
        : `New link saved.${mailNote(false)}`,
    };
  });
}

export async function revokeInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  return memberAction(slug, "members:manage", invitationIdSchema, form, async (member, data) => {
    const revoked = await revokeInvitation({
      labId: member.lab.id,
      invitationId: data.invitationId,
      actorUserId: member.user.id,
    });
    refresh(slug);
    return { ok: true, message: `The invitation to ${revoked.email} was revoked; its link no longer works.` };
  });
}

export async function changeMemberRoleAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  let selfDemoted = false;
  const state = await memberAction(slug, "members:manage", memberRoleFormSchema, form, async (member, data) => {
    const changed = await changeMemberRole({
      labId: member.lab.id,
      membershipId: data.membershipId,
      role: data.role,
      actorUserId: member.user.id,
    });
    selfDemoted = changed.changed && changed.userId === member.user.id && data.role !== "manager";
    refresh(slug);
    return {
      ok: true,
      message: changed.changed
        ? `${changed.name} is now ${ROLE_LABELS[changed.role].toLowerCase()}.`
        : `${changed.name} already has that role.`,
    };
  });
  if (selfDemoted) redirect(`/labs/${slug}`);
  return state;
}

export async function removeMemberAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const slug = slugOf(form);
  let removedSelf = false;
  const state = await memberAction(slug, "members:manage", memberIdSchema, form, async (member, data) => {
    const removed = await removeMember({
      labId: member.lab.id,
      membershipId: data.membershipId,
      actorUserId: member.user.id,
    });
    removedSelf = removed.userId === member.user.id;
    refresh(slug);
    return { ok: true, message: `${removed.name} was removed from the lab.` };
  });
  if (removedSelf) redirect("/dashboard");
  return state;
}
