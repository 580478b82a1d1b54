import { api } from "@/lib/http/route";
import { revokeToken } from "@/lib/ops/tokens";

export const DELETE = api<{ slug: string; id: string }>(({ caller, params }) =>
  revokeToken(caller, { lab: params.slug, tokenId: params.id }),
);
