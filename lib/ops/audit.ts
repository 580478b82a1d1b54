import "server-only";
import { listAuditEvents } from "@/db/queries/audit";
import { auditQuerySchema } from "@/lib/validation/audit";
import { labOperation } from "./operation";

export type { AuditEntry } from "@/db/queries/audit";

/** A lab's audit log, newest first, in keyset pages, filtered by kind, person and dates. */
export const listAudit = labOperation({
  name: "audit.list",
  capability: "audit:read",
  scope: "lab",
  input: auditQuerySchema,
  run: ({ labId }, query) => listAuditEvents({ labId, ...query }),
});
