import { checkJson } from "@/lib/editions/check-json";
import { api } from "@/lib/http/route";
import { checkByToken } from "@/lib/ops/postings";

// Public: the QR code on a poster opens this for anyone, signed in or not.
export const GET = api<{ token: string }>(
  async ({ caller, params }) =>
    Response.json(checkJson(await checkByToken(caller, params)), { headers: { "cache-control": "no-store" } }),
  { public: true },
);
