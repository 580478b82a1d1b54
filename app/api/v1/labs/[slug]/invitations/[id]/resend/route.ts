import { labRoute, parseWith } from "@/lib/auth/guard";
import { resendInvitation } from "@/lib/auth/invitations";
import { idParam } from "@/lib/validation/members";

export const POST = labRoute<{ slug: string; id: string }>("members:manage", async (_req, member, params) => {
  const { id } = parseWith(idParam, params);
  const { invitation, emailSent } = await resendInvitation(member, id);
  return Response.json({ invitation, emailSent });
});
