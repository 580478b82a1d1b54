import "server-only";
import { cache } from "react";
import { findSessionUser } from "@/db/queries/sessions";
import { auth } from "./config";

export type SessionUser = { id: number; email: string; name: string };

/**
 * The signed-in person, re-read from the database on every request: a deleted account, or a
 * cookie issued before the account's session version moved on (password reset, sign-out,
 * removal from a lab), has no session. Cached per render, so the header, the layout and the
 * page share one lookup.
 */
export const currentUser = cache(async function currentUser(): Promise<SessionUser | null> {
  const session = await auth();
  const id = Number(session?.user?.id);
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  const version = Number((session as { sessionVersion?: unknown } | null)?.sessionVersion ?? 0);
  if (!Number.isSafeInteger(version) || version < 0) return null;
  return findSessionUser({ id, sessionVersion: version });
});
