// Loopback addresses and URLs: pure, so lib/env.ts and the request code share them.
export const normaliseAddress = (ip: string) =>
  ip
    .trim()
    .replace(/^::ffff:/, "")
    .slice(0, 64);

/** 127.0.0.0/8, ::1 and the IPv4-mapped forms. */
export function isLoopback(ip: string | null): boolean {
  if (!ip) return false;
  const a = normaliseAddress(ip);
  return a === "::1" || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(a);
}

/** Whether a URL's host is a loopback name or address (localhost, 127.x, [::1]). */
export function isLoopbackUrl(url: string): boolean {
  let host: string;
  try {
    host = new URL(url).hostname.toLowerCase();
  } catch {
    return false;
  }
  if (host === "localhost" || host.endsWith(".localhost")) return true;
  return isLoopback(host.replace(/^\[|\]$/g, ""));
}
