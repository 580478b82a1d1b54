import { api } from "@/lib/http/route";
import { recordPosting } from "@/lib/ops/postings";

/** Records that a printed copy of this edition hangs in a room (201 new, 200 already recorded). */
export const POST = api<{ id: string }>(async ({ caller, params, body }) => {
  const { created, ...posting } = await recordPosting(caller, { editionId: params.id }, await body());
  return Response.json(posting, { status: created ? 201 : 200 });
});
