import { api } from "@/lib/http/route";
import { deleteStentPlatform, updateStentPlatform } from "@/lib/ops/stock";

type Params = { slug: string; id: string };

export const PATCH = api<Params>(async ({ caller, params, body }) =>
  updateStentPlatform(caller, { lab: params.slug, platformId: params.id }, await body()),
);

export const DELETE = api<Params>(({ caller, params }) =>
  deleteStentPlatform(caller, { lab: params.slug, platformId: params.id }),
);
