import { api } from "@/lib/http/route";
import { revokeInvitation } from "@/lib/ops/members";

export const DELETE = api<{ slug: string; id: string }>(async ({ caller, params }) => {
  await revokeInvitation(caller, { lab: params.slug, invitationId: params.id });
  return new Response(null, { status: 204 });
});
