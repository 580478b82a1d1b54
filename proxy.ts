// Pages answer 503 with a readable outage page while the database cannot be reached. An error
// boundary cannot set a status (and a rewrite's status is not kept), so the check happens here,
// before rendering: a probe of the database, and on failure the outage page itself. Route
// handlers under /api answer their own 503 JSON (lib/errors.ts); the calculator needs no database;
// the check page and short codes (/v/, /c/: plain route handlers, lib/http/check-page.ts) answer
// their own outage page, so a scan does not pay for this hop.
// Server actions (POSTs to page paths) first get their body checked, so a broken one is a 400.
import { NextResponse, type NextRequest } from "next/server";
import { databaseReachable } from "@/db/health";
import { env } from "@/lib/env";
import { checkActionPayload, isActionRequest, sameHostOrigin } from "@/lib/http/action-payload";
import { outageHtml } from "@/lib/outage-page";

export async function proxy(req: NextRequest) {
  // A server action with a body the framework cannot decode is refused here with 400, not a 500.
  if (isActionRequest(req.method, req.headers)) {
    if (!sameHostOrigin(req.headers))
      return NextResponse.json(
        { error: { code: "cross_site", message: "Forms are accepted only from this site's own pages." } },
        { status: 403 },
      );
    const check = await checkActionPayload(
      req.headers.get("content-type"),
      () => req.clone().text(),
      () => req.clone().formData(),
    );
    if (!check.ok)
      return NextResponse.json({ error: { code: "invalid_input", message: check.reason } }, { status: 400 });
  }
  if (await databaseReachable(env.DATABASE_URL)) return NextResponse.next();
  const { pathname } = req.nextUrl;
  const kind = pathname.startsWith("/v/") || pathname.startsWith("/c/") ? "check" : "page";
  return new NextResponse(outageHtml(kind), {
    status: 503,
    headers: { "content-type": "text/html; charset=utf-8", "retry-after": "30", "cache-control": "no-store" },
  });
}

export const config = {
  // Every page except the static files, the API, the calculator and the check page's handlers
  // (/v/<token> and /c/<code>; the members' page /v/<token>/lab is a page and stays matched).
  matcher: [
    "/((?!api/|_next/|calculator|v/[^/]+$|c/|icon|apple-icon|manifest|robots\\.txt|favicon\\.ico|.*\\.(?:svg|png|ico|webmanifest|txt)$).*)",
  ],
};
