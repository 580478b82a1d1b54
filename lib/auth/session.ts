import "server-only";
import { cache } from "react";
import { findUserById } from "@/db/queries/members";
import { auth } from "./config";

export type SessionUser = { id: number; email: string; name: string };

/**
 * The signed-in person, re-read from the database (a deleted account has no session). Cached per
 * render, so the header, the layout and the page share one lookup.
 */
export const currentUser = cache(async function currentUser(): Promise<SessionUser | null> {
  const session = await auth();
  const id = Number(session?.user?.id);
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  return findUserById({ id });
});
