import { listAuditEvents } from "@/db/queries/audit";
import { labRoute, parseWith } from "@/lib/auth/guard";
import { auditQuerySchema } from "@/lib/validation/audit";

export const GET = labRoute("audit:read", async (req, member) => {
  const query = parseWith(auditQuerySchema, Object.fromEntries(new URL(req.url).searchParams));
  const page = await listAuditEvents({
    labId: member.lab.id,
    before: query.before,
    after: query.after,
    limit: query.limit,
  });
  return Response.json(page);
});
