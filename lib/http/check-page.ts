import "server-only";
import { getCheckByToken, getCheckTokenByShortCode, type CheckView } from "@/db/queries/check";
import { limitPublic, RateLimitedError, type PublicKind } from "@/lib/auth/public-limit";
import { addressOf } from "@/lib/auth/request-address";
import { actionSentence } from "@/lib/editions/action";
import { CHECK_HEADLINES } from "@/lib/editions/check";
import { rewordedSentence } from "@/lib/editions/check-json";
import { askLine, checkCells } from "@/lib/editions/check-cells";
import { checkPageHtml, rateLimitedHtml, unknownCodeHtml, type CheckPageModel } from "@/lib/editions/check-html";
import { formatShortCode, parseShortCode } from "@/lib/editions/short-code";
import { isDatabaseUnreachable } from "@/lib/errors";
import { formatDate } from "@/lib/format/dates";
import { authorize } from "@/lib/ops/access";
import { sessionCaller } from "@/lib/ops/caller";
import { outageHtml } from "@/lib/outage-page";
import { checkTokenSchema } from "@/lib/validation/check";

// The public check page and the short-code redirect: plain HTML route handlers, so a scan
// downloads no framework runtime (lib/editions/check-html.ts).

const html = (body: string, status: number, extra: Record<string, string> = {}) =>
  new Response(body, {
    status,
    headers: { "content-type": "text/html; charset=utf-8", "cache-control": "private, no-store", ...extra },
  });

const unknown = () => html(unknownCodeHtml(), 404);

const DATE_WORD = { current: "Approved", outdated: "Stock or settings last changed", draft: "Drafted" } as const;

export function checkPageModel(view: CheckView, token: string): CheckPageModel {
  const tz = view.lab.timeZone;
  const label = view.status in DATE_WORD ? DATE_WORD[view.status as keyof typeof DATE_WORD] : "Since";
  const current = view.currentEdition;
  return {
    status: view.status,
    action: view.action,
    headline: CHECK_HEADLINES[view.status],
    dateLine: view.since ? `${label} ${formatDate(view.since, tz)}` : null,
    sentence: actionSentence(view.action, { reviewBy: view.reviewBy, replacement: current, timeZone: tz }),
    labName: view.lab.name,
    chartTitle: view.chart.title,
    editionNumber: view.edition.number,
    shortCode: formatShortCode(view.edition.shortCode),
    changes: view.changes.map((c) => c.detail),
    cells: checkCells(view),
    ask: view.action === "take-down" ? askLine(view.lab.contactLine) : null,
    currentLine: current
      ? `The current edition of this chart is edition ${current.number}${current.approvedAt ? `, approved ${formatDate(current.approvedAt, tz)}` : ""}.`
      : null,
    reworded: view.reworded ? rewordedSentence(view.reworded) : null,
    isDemo: view.lab.isDemo,
    signInHref: `/sign-in?callbackUrl=${encodeURIComponent(`/v/${token}/lab`)}`,
  };
}

/** Runs a public lookup under the per-address limit, answering 429 / 503 pages itself. */
async function guarded(req: Request, kind: PublicKind, fn: () => Promise<Response>): Promise<Response> {
  try {
    await limitPublic(kind, addressOf(req.headers));
    return await fn();
  } catch (err) {
    if (err instanceof RateLimitedError)
      return html(rateLimitedHtml(err.message), 429, { "retry-after": String(err.retryAfterSeconds) });
    if (isDatabaseUnreachable(err)) return html(outageHtml("check"), 503, { "retry-after": "30" });
    throw err;
  }
}

const hasSessionCookie = (req: Request) =>
  /(?:^|;\s*)(?:__Secure-)?authjs\.session-token/.test(req.headers.get("cookie") ?? "");

/** GET /v/<token>: the check page; members of the edition's lab go on to /v/<token>/lab (rooms, printing). */
export function checkPageResponse(req: Request, token: string): Promise<Response> {
  // The shape is checked before anything touches the database.
  if (!checkTokenSchema.safeParse(token).success) return Promise.resolve(unknown());
  return guarded(req, "check", async () => {
    const view = await getCheckByToken({ token });
    if (!view) return unknown();
    if (hasSessionCookie(req)) {
      const caller = await sessionCaller();
      const member =
        caller.kind === "user" ? await authorize(caller, { labId: view.lab.id }, "lab:read").catch(() => null) : null;
      if (member) return new Response(null, { status: 303, headers: { location: `/v/${token}/lab` } });
    }
    return html(checkPageHtml(checkPageModel(view, token)), 200);
  });
}

/** GET /c/<code>: the typed short code leads to the same check page as the QR code. */
export function shortCodeResponse(req: Request, input: string): Promise<Response> {
  const code = parseShortCode(input);
  if (!code) return Promise.resolve(unknown());
  return guarded(req, "short-code", async () => {
    const token = await getCheckTokenByShortCode({ code });
    if (!token) return unknown();
    return new Response(null, { status: 303, headers: { location: `/v/${token}`, "cache-control": "no-store" } });
  });
}
