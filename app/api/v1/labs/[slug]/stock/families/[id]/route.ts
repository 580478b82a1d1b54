import { api } from "@/lib/http/route";
import { deleteBalloonFamily, updateBalloonFamily } from "@/lib/ops/stock";

type Params = { slug: string; id: string };

export const PATCH = api<Params>(async ({ caller, params, body }) =>
  updateBalloonFamily(caller, { lab: params.slug, familyId: params.id }, await body()),
);

export const DELETE = api<Params>(({ caller, params }) =>
  deleteBalloonFamily(caller, { lab: params.slug, familyId: params.id }),
);
