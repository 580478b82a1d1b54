// Where next-auth may send someone after signing in or out: only a path of this app, or a URL
// on its own origin. next-auth answers a javascript: or otherwise unparsable callbackUrl with a
// 500 (InvalidCallbackUrl) and redirects a foreign one to the site root; both are refused here
// with 400 before next-auth runs.

/** Whether a callbackUrl is a path of this app or a URL on APP_URL's origin. */
export function isSafeCallbackUrl(value: string, appUrl: string): boolean {
  if (value.length > 2048) return false;
  if (value.startsWith("/")) {
    // "//host" and "/\host" are read by browsers as another host.
    if (value.startsWith("//") || value.startsWith("/\\")) return false;
    return !/[\u0000-\u001f\u007f]/.test(value);
  }
  try {
    const url = new URL(value);
    return (url.protocol === "http:" || url.protocol === "https:") && url.origin === new URL(appUrl).origin;
  } catch {
    return false;
  }
}

/** The callbackUrl values a request to next-auth carries (query string and, for forms, the body). */
export async function callbackUrlsOf(req: Request): Promise<string[]> {
  const found = new URL(req.url).searchParams.getAll("callbackUrl");
  const type = (req.headers.get("content-type") ?? "").toLowerCase();
  if (req.method === "POST" && type.startsWith("application/x-www-form-urlencoded")) {
    const body = await req.clone().text();
    found.push(...new URLSearchParams(body).getAll("callbackUrl"));
  }
  return found;
}
