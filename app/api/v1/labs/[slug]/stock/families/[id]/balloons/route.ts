import { api } from "@/lib/http/route";
import { createBalloon } from "@/lib/ops/stock";

export const POST = api<{ slug: string; id: string }>(
  async ({ caller, params, body }) => createBalloon(caller, { lab: params.slug, familyId: params.id }, await body()),
  { status: 201 },
);
