import "server-only";
import { currentUser, type SessionUser } from "@/lib/auth/session";
import type { TokenIdentity } from "@/db/queries/tokens";

/**
 * Who asks for an operation. Every operation receives one and checks what it may do. A machine
 * token (Authorization: Bearer) is a caller of its own: one lab and its scopes, no person.
 */
export type Caller =
  { kind: "anonymous" } | { kind: "user"; user: SessionUser } | { kind: "token"; token: TokenIdentity };

export type { Actor } from "@/db/queries/audit";

export const ANONYMOUS: Caller = { kind: "anonymous" };

/** The caller of the current request, from its session cookie (cached per render). */
export async function sessionCaller(): Promise<Caller> {
  const user = await currentUser();
  return user ? { kind: "user", user } : ANONYMOUS;
}
