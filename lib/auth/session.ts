import "server-only";
import { findUserById } from "@/db/queries/members";
import { auth } from "./config";

export type SessionUser = { id: number; email: string; name: string };

/** The signed-in person, re-read from the database (a deleted account has no session). */
export async function currentUser(): Promise<SessionUser | null> {
  const session = await auth();
  const id = Number(session?.user?.id);
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  return findUserById({ id });
}
