import { api } from "@/lib/http/route";
import { listAudit } from "@/lib/ops/audit";

export const GET = api<{ slug: string }>(({ caller, params, query }) =>
  listAudit(caller, { lab: params.slug }, query()),
);
