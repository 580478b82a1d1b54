import { api } from "@/lib/http/route";
import { listMembers } from "@/lib/ops/members";

export const GET = api<{ slug: string }>(async ({ caller, params }) => ({
  members: await listMembers(caller, { lab: params.slug }),
}));
