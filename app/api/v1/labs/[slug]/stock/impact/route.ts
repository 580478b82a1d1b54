import { api } from "@/lib/http/route";
import { stockImpact } from "@/lib/ops/stock";

/** POST `{"balloons":[{"id","inStock"}],…}` or `{"csv"}`: the posted copies the change would outdate; writes nothing. */
export const POST = api<{ slug: string }>(async ({ caller, params, body }) =>
  stockImpact(caller, { lab: params.slug }, await body()),
);
