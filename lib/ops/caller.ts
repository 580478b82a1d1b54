import "server-only";
import { currentUser, type SessionUser } from "@/lib/auth/session";

/** Who asks for an operation. Every operation receives one and checks what it may do. */
export type Caller = { kind: "anonymous" } | { kind: "user"; user: SessionUser };

export type { Actor } from "@/db/queries/audit";

export const ANONYMOUS: Caller = { kind: "anonymous" };

/** The caller of the current request, from its session cookie (cached per render). */
export async function sessionCaller(): Promise<Caller> {
  const user = await currentUser();
  return user ? { kind: "user", user } : ANONYMOUS;
}
