import "server-only";
import { createInvitation, renewInvitation } from "@/db/queries/invitations";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send";
import { invitationMail } from "@/lib/mail/templates";
import type { Role } from "@/lib/permissions";
import type { Member } from "./guard";
import { INVITATION_TTL_MS, newToken } from "./tokens";
import { log } from "@/lib/log";

export const invitationLink = (token: string) => `${env.APP_URL}/invite/${token}`;

async function mailInvitation(
  member: Member,
  to: string,
  role: Role,
  token: string,
  expiresAt: Date,
): Promise<boolean> {
  try {
    await sendMail({
      to,
      ...invitationMail({
        labName: member.lab.name,
        role,
        inviterName: member.user.name,
        link: invitationLink(token),
        expiresAt,
      }),
    });
    return true;
  } catch (err) {
    log.error({ err, operation: "invitation.mail" }, "invitation e-mail failed");
    return false;
  }
}

/** Stores the invitation (hash only) with its audit record, then e-mails the link. */
export async function inviteMember(member: Member, input: { email: string; role: Role }) {
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  const invitation = await createInvitation({
    labId: member.lab.id,
    email: input.email,
    role: input.role,
    invitedBy: member.user.id,
    tokenHash: hash,
    expiresAt,
  });
  const emailSent = await mailInvitation(member, input.email, input.role, token, expiresAt);
  return { invitation, emailSent };
}

/** A new token and a new e-mail; the previous link stops working. */
export async function resendInvitation(member: Member, invitationId: number) {
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  const invitation = await renewInvitation({
    labId: member.lab.id,
    invitationId,
    actorUserId: member.user.id,
    tokenHash: hash,
    expiresAt,
  });
  const emailSent = await mailInvitation(member, invitation.email, invitation.role, token, expiresAt);
  return { invitation, emailSent };
}
