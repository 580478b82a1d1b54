import "server-only";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import { authorize, type Member } from "@/lib/ops/access";
import { sessionCaller } from "@/lib/ops/caller";
import { toAppError } from "@/lib/http/respond";
import type { Capability } from "@/lib/permissions";

/**
 * The page-side answer to the operations layer's refusals: anonymous -> sign-in, not a member ->
 * 404 page, role too low -> "forbidden" for the page to render its own explanation.
 */
export const memberForPage = cache(async function memberForPage(
  slug: string,
  capability: Capability,
  returnTo: string,
): Promise<Member | "forbidden"> {
  try {
    return await authorize(await sessionCaller(), { lab: slug }, capability);
  } catch (err) {
    const known = toAppError(err);
    if (known?.status === 401) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
    if (known?.status === 403) return "forbidden";
    if (known?.status === 404) notFound();
    throw err;
  }
});
