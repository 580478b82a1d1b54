import { listMembers } from "@/db/queries/members";
import { labRoute } from "@/lib/auth/guard";

export const GET = labRoute("members:manage", async (_req, member) => {
  const members = await listMembers({ labId: member.lab.id });
  return Response.json({ members });
});
