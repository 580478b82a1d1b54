import "server-only";
import { env } from "@/lib/env";
import { mailFakeConfigured } from "@/lib/mail/send";
import { listMyLabs } from "./accounts";
import type { Caller } from "./caller";
import { machineRefused } from "./access";

/**
 * What the site header shows the visitor, fetched by the page after it loads so that pages that
 * depend on nobody (the landing page, the calculator) can be prerendered.
 */
export async function headerInfo(caller: Caller) {
  if (caller.kind === "token") throw machineRefused();
  // signUp: whether a visitor may create an account here (the landing page offers it then).
  if (caller.kind !== "user") return { user: null, labs: [], mailLink: false, signUp: env.SIGNUP === "open" };
  const labs = await listMyLabs(caller);
  return {
    user: { name: caller.user.name },
    labs: labs.map((l) => ({ slug: l.slug, name: l.name, role: l.role })),
    mailLink: mailFakeConfigured(),
    signUp: false,
  };
}
