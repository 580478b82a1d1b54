import type { NextRequest } from "next/server";
import { callbackUrlsOf, isSafeCallbackUrl } from "@/lib/auth/callback-url";
import { handlers } from "@/lib/auth/config";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { errorResponse } from "@/lib/http/respond";

// next-auth's own endpoints, behind one check: a callbackUrl that is not ours is a 400.
const guarded =
  (handler: (req: NextRequest) => Promise<Response>) =>
  async (req: NextRequest): Promise<Response> => {
    if (req.method === "GET" && req.nextUrl.pathname.endsWith("/callback/credentials"))
      return Response.json(
        { error: { code: "method_not_allowed", message: "Sign in with the form (POST)." } },
        { status: 405, headers: { allow: "POST" } },
      );
    const bad = (await callbackUrlsOf(req)).find((u) => !isSafeCallbackUrl(u, env.APP_URL));
    if (bad !== undefined) {
      const message = "callbackUrl must be a path of this site.";
      return errorResponse(new AppError("invalid_input", message, [{ path: ["callbackUrl"], message }]));
    }
    return handler(req);
  };

export const GET = guarded(handlers.GET);
export const POST = guarded(handlers.POST);
