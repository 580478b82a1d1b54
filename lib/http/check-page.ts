import "server-only";
import { getCheckTokenByShortCode, getCheckVersion } from "@/db/queries/check";
import { getCheckByToken, type CheckView } from "@/lib/ops/check";
import { isRateLimited, limitPublic, type PublicKind } from "@/lib/auth/public-limit";
import { addressOf } from "@/lib/auth/request-address";
import { ACTION_HEADINGS, actionSentence } from "@/lib/editions/action";
import { CHECK_HEADLINES } from "@/lib/editions/check";
import { rewordedSentence } from "@/lib/editions/check-json";
import { checkCells } from "@/lib/editions/check-cells";
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

const DATE_WORD = { current: "Approved", outdated: "Stock or settings last changed", draft: "Drafted" } as const;

export function checkPageModel(view: CheckView, token: string): CheckPageModel {
  const tz = view.lab.timeZone;
  const label = view.status in DATE_WORD ? DATE_WORD[view.status as keyof typeof DATE_WORD] : "Since";
  const current = view.currentEdition;
  return {
    status: view.status,
    action: view.action,
    heading: ACTION_HEADINGS[view.action],
    statusWord: CHECK_HEADLINES[view.status],
    warning: view.status === "withdrawn" || view.status === "draft" ? "Do not rely on this printout's numbers." : null,
    dateLine: view.since ? `${label} ${formatDate(view.since, tz)}` : null,
    sentence: actionSentence(view.action, {
      reviewBy: view.reviewBy,
      replacement: current,
      timeZone: tz,
      contactLine: view.lab.contactLine,
    }),
    labName: view.lab.name,
    chartTitle: view.chart.title,
    editionNumber: view.edition.number,
    shortCode: formatShortCode(view.edition.shortCode),
    changes: view.changes.map((c) => c.detail),
    cells: checkCells(view),
    // The replace sentence already names the current edition.
    currentLine:
      current && view.action !== "replace"
        ? `The current edition of this chart is edition ${current.number}${current.approvedAt ? `, approved ${formatDate(current.approvedAt, tz)}` : ""}.`
        : null,
    reworded: view.reworded ? rewordedSentence(view.reworded) : null,
    isDemo: view.lab.isDemo,
    signInHref: `/sign-in?callbackUrl=${encodeURIComponent(`/v/${token}/lab`)}`,
  };
}

/** An answer as status, headers and body: a Response for Next, or written straight to the socket by server.mjs. */
export type Reply = {
  status: number;
  headers: Record<string, string>;
  body: string | null;
  /** Where server.mjs's direct path keeps this body's gzip form (a cached page's). */
  memo?: { gzip?: Buffer };
};

const htmlReply = (body: string, status: number, extra: Record<string, string> = {}): Reply => ({
  status,
  headers: { "content-type": "text/html; charset=utf-8", "cache-control": "private, no-store", ...extra },
  body,
});

const unknown = (typed?: string) => htmlReply(unknownCodeHtml(typed), 404);

/** Runs a public lookup under the per-address limit, answering 429 / 503 pages itself. */
async function guarded(headers: Headers, kind: PublicKind, fn: () => Promise<Reply>): Promise<Reply> {
  try {
    await limitPublic(kind, addressOf(headers));
    return await fn();
  } catch (err) {
    if (isRateLimited(err))
      return htmlReply(rateLimitedHtml(err.message), 429, { "retry-after": String(err.retryAfterSeconds ?? 60) });
    if (isDatabaseUnreachable(err)) return htmlReply(outageHtml("check"), 503, { "retry-after": "30" });
    throw err;
  }
}

export const hasSessionCookie = (headers: Headers) =>
  /(?:^|;\s*)(?:__Secure-)?authjs\.session-token/.test(headers.get("cookie") ?? "");

// Built pages by token, kept while nothing they show has changed. Each scan still asks MariaDB
// (getCheckVersion: one indexed row, no snapshots), so a change made on any instance or Galera
// node shows on the next scan; only the building (snapshots parsed, cells compared, HTML
// written) is saved. Scans of one token that arrive while its version query runs share it.
export type CheckPage = { labId: number; html: string; gzip?: Buffer };
type Cached = { key: string; page: CheckPage };
const CACHE_SIZE = 500;
const g = globalThis as unknown as {
  forkwallCheckPages?: Map<string, Cached>;
  forkwallCheckVersions?: Map<string, ReturnType<typeof getCheckVersion>>;
};
const pages = (g.forkwallCheckPages ??= new Map());
const inFlight = (g.forkwallCheckVersions ??= new Map());

function versionOf(token: string) {
  let q = inFlight.get(token);
  if (!q) {
    q = getCheckVersion({ token }).finally(() => inFlight.delete(token));
    inFlight.set(token, q);
  }
  return q;
}

// The page also changes when the review-by date passes (keep becomes review).
const keyOf = (v: { version: string; reviewBy: Date | null }, now: Date) =>
  `${v.version}${v.reviewBy !== null && v.reviewBy.getTime() <= now.getTime() ? " due" : ""}`;

/** The check page for a well-formed token (cached while its version holds), or null when no edition has it. */
export async function checkPageFor(token: string): Promise<CheckPage | null> {
  const v = await versionOf(token);
  if (!v) return null;
  const now = new Date();
  const hit = pages.get(token);
  if (hit && hit.key === keyOf(v, now)) return hit.page;
  const view = await getCheckByToken({ token, now });
  if (!view) return null;
  const page: CheckPage = { labId: view.lab.id, html: checkPageHtml(checkPageModel(view, token)) };
  // Kept only when nothing changed while it was built, so a cached page is never older than its key.
  const after = await getCheckVersion({ token });
  if (after && after.version === v.version) {
    pages.delete(token);
    pages.set(token, { key: keyOf(after, now), page });
    if (pages.size > CACHE_SIZE) pages.delete(pages.keys().next().value as string);
  }
  return page;
}

/** GET /v/<token>: the check page; members of the edition's lab go on to /v/<token>/lab (rooms, printing). */
export async function checkPageReply(headers: Headers, token: string): Promise<Reply> {
  // The shape is checked before anything touches the database.
  if (!checkTokenSchema.safeParse(token).success) return unknown();
  return guarded(headers, "check", async () => {
    const page = await checkPageFor(token);
    if (!page) return unknown();
    if (hasSessionCookie(headers)) {
      const caller = await sessionCaller();
      const member =
        caller.kind === "user" ? await authorize(caller, { labId: page.labId }, "lab:read").catch(() => null) : null;
      if (member) return { status: 303, headers: { location: `/v/${token}/lab` }, body: null };
    }
    return { ...htmlReply(page.html, 200), memo: page };
  });
}

/** GET /c/<code>: the typed short code leads to the same check page as the QR code. */
export async function shortCodeReply(headers: Headers, input: string): Promise<Reply> {
  const code = parseShortCode(input);
  if (!code) return unknown(input);
  return guarded(headers, "short-code", async () => {
    const token = await getCheckTokenByShortCode({ code });
    if (!token) return unknown(input);
    return { status: 303, headers: { location: `/v/${token}`, "cache-control": "no-store" }, body: null };
  });
}

export const toResponse = (r: Reply) => new Response(r.body, { status: r.status, headers: r.headers });
