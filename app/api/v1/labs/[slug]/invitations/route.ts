import { api } from "@/lib/http/route";
import { inviteMember, listInvitations } from "@/lib/ops/members";

export const GET = api<{ slug: string }>(({ caller, params }) => listInvitations(caller, { lab: params.slug }));

export const POST = api<{ slug: string }>(
  async ({ caller, params, body }) => inviteMember(caller, { lab: params.slug }, await body()),
  { status: 201 },
);
