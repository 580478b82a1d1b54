import "server-only";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import { authorize, type Member } from "@/lib/ops/access";
import { sessionCaller, type Caller } from "@/lib/ops/caller";
import { toAppError } from "@/lib/http/respond";
import type { Capability } from "@/lib/permissions";

/**
 * The signed-in member of a page's lab (with the caller, for the operations the page then calls), and the
 * page-side answer to the operations layer's refusals: anonymous -> sign-in, not a member ->
 * 404 page, role too low -> "forbidden" for the page to render its own explanation.
 */
export const memberForPage = cache(async function memberForPage(
  slug: string,
  capability: Capability,
  returnTo: string,
): Promise<(Member & { caller: Caller }) | "forbidden"> {
  try {
    const caller = await sessionCaller();
    return { ...(await authorize(caller, { lab: slug }, capability)), caller };
  } catch (err) {
    const known = toAppError(err);
    if (known?.status === 401) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
    if (known?.status === 403) return "forbidden";
    if (known?.status === 404) notFound();
    throw err;
  }
});

/** Runs an operation for a page: its refusals become the sign-in redirect, the 404 page or "forbidden". */
export async function forPage<T>(returnTo: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (err) {
    const known = toAppError(err);
    if (known?.status === 401) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
    if (known?.status === 404) notFound();
    throw err;
  }
}
