import { api } from "@/lib/http/route";
import { createBalloonFamily } from "@/lib/ops/stock";

export const POST = api<{ slug: string }>(
  async ({ caller, params, body }) => createBalloonFamily(caller, { lab: params.slug }, await body()),
  { status: 201 },
);
