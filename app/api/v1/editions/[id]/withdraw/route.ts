import { api } from "@/lib/http/route";
import { withdrawEdition } from "@/lib/ops/editions";

export const POST = api<{ id: string }>(async ({ caller, params, body }) => {
  const ed = await withdrawEdition(caller, { editionId: params.id }, await body({ optional: true }));
  return { id: ed.id, number: ed.number, status: ed.status };
});
