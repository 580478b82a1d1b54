import { limitPublic } from "@/lib/auth/public-limit";
import { addressOf } from "@/lib/auth/request-address";
import { checkJson } from "@/lib/editions/check-json";
import { api } from "@/lib/http/route";
import { checkByToken } from "@/lib/ops/postings";

// Public: the QR code on a poster opens this for anyone, signed in or not; rate-limited per address.
export const GET = api<{ token: string }>(
  async ({ req, caller, params }) => {
    await limitPublic("check", addressOf(req.headers));
    const view = await checkByToken(caller, params);
    return Response.json(checkJson(view), { headers: { "cache-control": "no-store" } });
  },
  { public: true },
);
