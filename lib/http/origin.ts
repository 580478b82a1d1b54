// Cross-site write protection for route handlers (finding 5), as a pure function the request
// layer calls before a handler runs. Browsers send Origin on every cross-origin request and on
// same-origin non-GET requests, and Sec-Fetch-Site (Fetch Metadata) on all requests; a form or
// no-cors fetch from another site (or another port of the same host, which is another origin)
// carries one of them naming somewhere else. JSON bodies must say exactly application/json,
// which a cross-site form or no-cors request cannot send without a CORS preflight.
// Machine tokens (Authorization: Bearer) carry no ambient cookie, so they are exempt.

export type WriteCheck = { ok: true } | { ok: false; status: 403 | 415; code: string; message: string };

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

const deny = (status: 403 | 415, code: string, message: string): WriteCheck => ({ ok: false, status, code, message });

/** The media type of a Content-Type header, lower-cased, without parameters. */
export function mediaType(contentType: string | null): string {
  return (contentType ?? "").split(";")[0]!.trim().toLowerCase();
}

export function checkWriteRequest(
  req: { method: string; headers: Headers },
  appUrl: string,
  opts: { jsonBody?: boolean } = {},
): WriteCheck {
  const method = req.method.toUpperCase();
  if (SAFE_METHODS.has(method)) return { ok: true };
  const h = req.headers;
  if (/^Bearer\s+\S+/i.test(h.get("authorization") ?? "")) return { ok: true };

  const expected = new URL(appUrl).origin;
  const origin = h.get("origin");
  const site = h.get("sec-fetch-site")?.toLowerCase();
  if (origin !== null) {
    // "null" is what sandboxed frames, file: pages and some redirects send: never ours.
    if (origin !== expected)
      return deny(403, "cross_site", `Writes are accepted only from ${expected}; this request came from ${origin}.`);
  } else if (site !== undefined && site !== "same-origin" && site !== "none") {
    return deny(403, "cross_site", `Writes are accepted only from pages of ${expected} (Sec-Fetch-Site: ${site}).`);
  }
  // Neither header: not a browser (curl, scripts, tests); it holds no victim's cookie by accident.

  if (opts.jsonBody && mediaType(h.get("content-type")) !== "application/json")
    return deny(415, "unsupported_media_type", "Send the body as JSON with Content-Type: application/json.");
  return { ok: true };
}
