import { api } from "@/lib/http/route";
import { rejectEdition } from "@/lib/ops/editions";

export const POST = api<{ id: string }>(async ({ caller, params, body }) =>
  rejectEdition(caller, { editionId: params.id }, await body()),
);
