import { changeMemberRole, removeMember } from "@/db/queries/members";
import { labRoute, parseWith, readJson } from "@/lib/auth/guard";
import { changeRoleSchema, idParam } from "@/lib/validation/members";

type Params = { slug: string; id: string };

export const PATCH = labRoute<Params>("members:manage", async (req, member, params) => {
  const { id } = parseWith(idParam, params);
  const { role } = parseWith(changeRoleSchema, await readJson(req));
  const changed = await changeMemberRole({ labId: member.lab.id, membershipId: id, role, actorUserId: member.user.id });
  return Response.json({
    member: { id, userId: changed.userId, name: changed.name, email: changed.email, role: changed.role },
    changed: changed.changed,
  });
});

export const DELETE = labRoute<Params>("members:manage", async (_req, member, params) => {
  const { id } = parseWith(idParam, params);
  await removeMember({ labId: member.lab.id, membershipId: id, actorUserId: member.user.id });
  return new Response(null, { status: 204 });
});
