import { api } from "@/lib/http/route";
import { createStentSize } from "@/lib/ops/stock";

export const POST = api<{ slug: string; id: string }>(
  async ({ caller, params, body }) =>
    createStentSize(caller, { lab: params.slug, platformId: params.id }, await body()),
  { status: 201 },
);
