import { revokeInvitation } from "@/db/queries/invitations";
import { labRoute, parseWith } from "@/lib/auth/guard";
import { idParam } from "@/lib/validation/members";

export const DELETE = labRoute<{ slug: string; id: string }>("members:manage", async (_req, member, params) => {
  const { id } = parseWith(idParam, params);
  await revokeInvitation({ labId: member.lab.id, invitationId: id, actorUserId: member.user.id });
  return new Response(null, { status: 204 });
});
