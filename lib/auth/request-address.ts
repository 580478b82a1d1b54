import "server-only";
import { headers } from "next/headers";
import { env } from "@/lib/env";
import { clientAddress, socketAddress } from "@/lib/http/client-address";
import { isLoopback } from "@/lib/net/loopback";

/** The client's address for throttles and audit rows (the socket's, unless TRUST_PROXY names hops). */
export function addressOf(h: Headers): string {
  return clientAddress(h, env.TRUST_PROXY);
}

/** The current request's client address (server components and actions). */
export async function requestAddress(): Promise<string> {
  return addressOf(await headers());
}

/** Whether the current request's TCP peer is this machine (never read from a client-sent header). */
export async function requestFromLoopback(): Promise<boolean> {
  return isLoopback(socketAddress(await headers()));
}
