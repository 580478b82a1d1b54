import { api } from "@/lib/http/route";
import { createStentPlatform } from "@/lib/ops/stock";

export const POST = api<{ slug: string }>(
  async ({ caller, params, body }) => createStentPlatform(caller, { lab: params.slug }, await body()),
  { status: 201 },
);
