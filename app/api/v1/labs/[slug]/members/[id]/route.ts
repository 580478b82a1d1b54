import { api } from "@/lib/http/route";
import { changeMemberRole, removeMember } from "@/lib/ops/members";

type Params = { slug: string; id: string };

export const PATCH = api<Params>(async ({ caller, params, body }) => {
  const changed = await changeMemberRole(caller, { lab: params.slug, membershipId: params.id }, await body());
  const { id, userId, name, email, role } = changed;
  return { member: { id, userId, name, email, role }, changed: changed.changed };
});

export const DELETE = api<Params>(async ({ caller, params }) => {
  await removeMember(caller, { lab: params.slug, membershipId: params.id });
  return new Response(null, { status: 204 });
});
