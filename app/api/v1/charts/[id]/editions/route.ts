import { api } from "@/lib/http/route";
import { createEdition } from "@/lib/ops/editions";

export const POST = api<{ id: string }>(
  async ({ caller, params, body }) => createEdition(caller, { chartId: params.id }, await body({ optional: true })),
  { status: 201 },
);
