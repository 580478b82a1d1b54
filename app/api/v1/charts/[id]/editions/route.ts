import { api } from "@/lib/http/route";
import { createEdition } from "@/lib/ops/editions";

// 201 for a new draft; 200 with the same id when an identical draft already waits.
export const POST = api<{ id: string }>(async ({ caller, params, body }) => {
  const ed = await createEdition(caller, { chartId: params.id }, await body({ optional: true }));
  return Response.json(ed, { status: ed.reused ? 200 : 201 });
});
