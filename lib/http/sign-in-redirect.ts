// A link opened from an e-mail by someone signed out: the browser gets the sign-in page, which
// returns to the link afterwards; programs keep their JSON 401.

/** True for a top-level browser navigation (a clicked link), not a fetch or a program. */
export function isBrowserNavigation(headers: Headers): boolean {
  if (headers.get("authorization")) return false;
  const mode = headers.get("sec-fetch-mode");
  if (mode) return mode === "navigate";
  return (headers.get("accept") ?? "").includes("text/html");
}

/** Where to send a signed-out navigation to `url`: sign-in, coming back to the same path and query. */
export function signInRedirectFor(url: string): string {
  const { pathname, search } = new URL(url);
  return `/sign-in?${new URLSearchParams({ callbackUrl: `${pathname}${search}` })}`;
}
