import { listOpenInvitations } from "@/db/queries/invitations";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { inviteMember } from "@/lib/auth/invitations";
import { inviteSchema } from "@/lib/validation/members";

export const GET = labRoute("members:manage", async (_req, member) => {
  return Response.json({ invitations: await listOpenInvitations({ labId: member.lab.id }) });
});

export const POST = labRoute("members:manage", async (req, member) => {
  const input = parseWith(inviteSchema, await readJson(req));
  const { invitation, emailSent } = await inviteMember(member, input);
  return Response.json({ invitation, emailSent }, { status: 201 });
});
