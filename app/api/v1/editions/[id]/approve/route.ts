import { api } from "@/lib/http/route";
import { approveEdition } from "@/lib/ops/editions";

export const POST = api<{ id: string }>(async ({ caller, params, body }) =>
  approveEdition(caller, { editionId: params.id }, await body({ optional: true })),
);
