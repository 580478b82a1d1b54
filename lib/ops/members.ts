import "server-only";
import { z } from "zod";
import * as invitations from "@/db/queries/invitations";
import * as members from "@/db/queries/members";
import * as tokens from "@/db/queries/tokens";
import { labLimits } from "@/lib/auth/lab-limits";
import { tokenDisableReason } from "@/lib/auth/machine-tokens";
import { INVITATION_TTL_MS, newToken } from "@/lib/auth/tokens";
import { env } from "@/lib/env";
import { log } from "@/lib/log";
import { sendMail } from "@/lib/mail/send";
import { invitationMail } from "@/lib/mail/templates";
import type { Role } from "@/lib/permissions";
import { changeRoleSchema, inviteSchema } from "@/lib/validation/members";
import type { Member } from "./access";
import { labOperation } from "./operation";
import { labWrite } from "./write";

export const invitationLink = (token: string) => `${env.APP_URL}/invite/${token}`;

/** Mails an invitation's link; false (logged) when the mail could not be handed to SMTP. */
export async function mailInvitation(
  from: { labId: number; labName: string; inviterName: string; timeZone: string },
  to: string,
  role: Role,
  token: string,
  expiresAt: Date,
) {
  try {
    const link = invitationLink(token);
    await sendMail({
      to,
      ...invitationMail({
        labName: from.labName,
        role,
        inviterName: from.inviterName,
        link,
        expiresAt,
        timeZone: from.timeZone,
      }),
    });
    return true;
  } catch (err) {
    log.warn({ err, labId: from.labId }, "invitation e-mail failed");
    return false;
  }
}

const sender = (member: Member) => ({
  labId: member.lab.id,
  labName: member.lab.name,
  inviterName: member.user.name,
  timeZone: member.lab.timeZone,
});

export const listMembers = labOperation({
  name: "member.list",
  capability: "members:manage",
  scope: "lab",
  run: ({ labId }) => members.listMembers({ labId }),
});

export const listInvitations = labOperation({
  name: "invitation.list",
  capability: "members:manage",
  scope: "lab",
  run: async ({ labId }) => ({ invitations: await invitations.listOpenInvitations({ labId }) }),
});

/**
 * Stores the invitation (hash only) with its audit record, then e-mails the link after commit;
 * invitations and resends together at most INVITATION_MAILS_PER_LAB_PER_HOUR per lab (429).
 */
export const inviteMember = labOperation({
  name: "invitation.create",
  capability: "members:manage",
  scope: "lab",
  input: inviteSchema,
  run: ({ labId, member }, input) =>
    labLimits().invitationMail(labId, async () => {
      const { token, hash } = newToken();
      const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
      const invitation = await labWrite(labId, (tx) =>
        invitations.createInvitation(tx, { labId, ...input, invitedBy: member.user.id, tokenHash: hash, expiresAt }),
      );
      const emailSent = await mailInvitation(sender(member), input.email, input.role, token, expiresAt);
      return { invitation, emailSent };
    }),
});

/** A new token and a new e-mail; the previous link stops working. */
export const resendInvitation = labOperation({
  name: "invitation.resend",
  capability: "members:manage",
  scope: "lab",
  ids: { invitationId: "That invitation" },
  run: ({ labId, member, ids }) =>
    labLimits().invitationMail(labId, async () => {
      const { token, hash } = newToken();
      const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
      const invitation = await labWrite(labId, (tx) =>
        invitations.renewInvitation(tx, {
          labId,
          invitationId: ids.invitationId,
          actorUserId: member.user.id,
          tokenHash: hash,
          expiresAt,
        }),
      );
      const emailSent = await mailInvitation(sender(member), invitation.email, invitation.role, token, expiresAt);
      return { invitation, emailSent };
    }),
});

export const revokeInvitation = labOperation({
  name: "invitation.revoke",
  capability: "members:manage",
  scope: "lab",
  ids: { invitationId: "That invitation" },
  run: ({ labId, actor, ids }) =>
    labWrite(labId, (tx) =>
      invitations.revokeInvitation(tx, { labId, invitationId: ids.invitationId, actorUserId: actor.id }),
    ),
});

export const changeMemberRole = labOperation({
  name: "member.role",
  capability: "members:manage",
  scope: "lab",
  ids: { membershipId: "That member" },
  input: changeRoleSchema,
  run: ({ labId, actor, ids }, { role }) =>
    labWrite(labId, async (tx) => {
      const changed = await members.changeMemberRole(tx, {
        labId,
        membershipId: ids.membershipId,
        role,
        actorUserId: actor.id,
      });
      const reason = changed.changed ? tokenDisableReason(changed.name, { role }) : null;
      if (reason) await tokens.disableTokensOf(tx, { labId, userId: changed.userId, reason, actorUserId: actor.id });
      return changed;
    }),
});

export const removeMember = labOperation({
  name: "member.remove",
  capability: "members:manage",
  scope: "lab",
  ids: { membershipId: "That member" },
  run: ({ labId, actor, ids }) =>
    labWrite(labId, async (tx) => {
      const removed = await members.removeMember(tx, { labId, membershipId: ids.membershipId, actorUserId: actor.id });
      const reason = tokenDisableReason(removed.name, "removed")!;
      await tokens.disableTokensOf(tx, { labId, userId: removed.userId, reason, actorUserId: actor.id });
      return removed;
    }),
});

/** A member's own choice: e-mail me when posted copies go stale. Only ever changes the caller's own membership. */
export const setStaleMail = labOperation({
  name: "member.stale_mail",
  capability: "lab:read",
  scope: "lab",
  input: z.object({ on: z.boolean() }).strict(),
  run: async ({ labId, actor }, { on }) => {
    await labWrite(labId, (tx) => members.setStaleMailSetting(tx, { labId, userId: actor.id, on }));
    return { on };
  },
});

export const getStaleMail = labOperation({
  name: "member.stale_mail.read",
  capability: "lab:read",
  scope: "lab",
  run: ({ labId, actor }) => members.getStaleMailSetting({ labId, userId: actor.id }),
});
