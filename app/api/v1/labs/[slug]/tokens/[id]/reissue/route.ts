import { api } from "@/lib/http/route";
import { reissueToken } from "@/lib/ops/tokens";

export const POST = api<{ slug: string; id: string }>(
  ({ caller, params }) => reissueToken(caller, { lab: params.slug, tokenId: params.id }),
  { status: 201 },
);
