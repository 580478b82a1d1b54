import { api } from "@/lib/http/route";
import { deleteStentSize, updateStentSize } from "@/lib/ops/stock";

type Params = { slug: string; id: string };

export const PATCH = api<Params>(async ({ caller, params, body }) =>
  updateStentSize(caller, { lab: params.slug, sizeId: params.id }, await body()),
);

export const DELETE = api<Params>(({ caller, params }) =>
  deleteStentSize(caller, { lab: params.slug, sizeId: params.id }),
);
