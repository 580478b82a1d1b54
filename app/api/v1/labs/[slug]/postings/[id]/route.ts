import { api } from "@/lib/http/route";
import { takeDownPosting } from "@/lib/ops/postings";

/** Takes a printed copy down from its wall. */
export const DELETE = api<{ slug: string; id: string }>(async ({ caller, params }) => {
  await takeDownPosting(caller, { lab: params.slug, postingId: params.id });
  return new Response(null, { status: 204 });
});
