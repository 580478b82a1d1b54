import { api } from "@/lib/http/route";
import { createToken, listTokens } from "@/lib/ops/tokens";

export const GET = api<{ slug: string }>(({ caller, params }) => listTokens(caller, { lab: params.slug }));

// 201 with the token in `token`: shown this once; only its hash is kept.
export const POST = api<{ slug: string }>(
  async ({ caller, params, body }) => createToken(caller, { lab: params.slug }, await body()),
  { status: 201 },
);
