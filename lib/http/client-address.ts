// Who is on the other end of a request. The socket's address is the only one the client
// cannot choose; server.mjs copies it into PEER_HEADER (replacing anything the client sent).
// X-Forwarded-For entries are believed only for the number of proxy hops TRUST_PROXY names:
// each trusted proxy appends the address it saw, so with n hops the client is the n-th entry
// from the right of [...X-Forwarded-For, socket address].
import { normaliseAddress as normalise } from "@/lib/net/loopback";

export const PEER_HEADER = "x-forkwall-peer";

/** The TCP peer's address as server.mjs recorded it; null when the request did not come through it. */
export function socketAddress(headers: Headers): string | null {
  const peer = headers.get(PEER_HEADER)?.trim();
  return peer ? normalise(peer) : null;
}

export function clientAddress(headers: Headers, trustProxyHops: number): string {
  const peer = socketAddress(headers);
  if (!peer) return "unknown";
  if (trustProxyHops <= 0) return peer;
  const chain = [
    ...(headers.get("x-forwarded-for") ?? "")
      .split(",")
      .map((s) => s.trim())
      .filter(Boolean),
    peer,
  ];
  return normalise(chain[Math.max(0, chain.length - 1 - trustProxyHops)]!);
}
