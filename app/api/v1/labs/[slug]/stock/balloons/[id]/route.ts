import { api } from "@/lib/http/route";
import { deleteBalloon, updateBalloon } from "@/lib/ops/stock";

type Params = { slug: string; id: string };

export const PATCH = api<Params>(async ({ caller, params, body }) =>
  updateBalloon(caller, { lab: params.slug, balloonId: params.id }, await body()),
);

export const DELETE = api<Params>(({ caller, params }) =>
  deleteBalloon(caller, { lab: params.slug, balloonId: params.id }),
);
