import "server-only";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import { AppError } from "@/lib/errors";
import type { Capability } from "@/lib/permissions";
import { requireMember, type Member } from "./guard";

/**
 * The page-side twin of requireMember: anonymous -> sign-in, not a member -> 404 page,
 * role too low -> "forbidden" for the page to render its own explanation.
 */
export const memberForPage = cache(async function memberForPage(
  slug: string,
  capability: Capability,
  returnTo: string,
): Promise<Member | "forbidden"> {
  try {
    return await requireMember({ slug }, capability);
  } catch (err) {
    if (err instanceof AppError && err.status === 401) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
    if (err instanceof AppError && err.status === 403) return "forbidden";
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  }
});
