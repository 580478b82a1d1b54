import { api } from "@/lib/http/route";
import { resendInvitation } from "@/lib/ops/members";

export const POST = api<{ slug: string; id: string }>(({ caller, params }) =>
  resendInvitation(caller, { lab: params.slug, invitationId: params.id }),
);
