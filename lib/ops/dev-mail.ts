import "server-only";
import { env } from "@/lib/env";
import type { FakeMessage } from "@/lib/mail/fake-server";
import { mailFor } from "@/lib/mail/own-mail";
import { verifiedAccount } from "./account-settings";
import type { Caller } from "./caller";
import { traced } from "./operation";

/**
 * The local mail page: the signed-in person's own mail only, at their confirmed address, whatever
 * their role in any lab (a reset or invitation link in someone else's mail is that account).
 * `messages` is null when the fake does not answer.
 */
export async function readOwnMail(caller: Caller): Promise<{ address: string; messages: FakeMessage[] | null }> {
  const account = await verifiedAccount(caller);
  return traced("dev.mail.read", { userId: account.id }, async () => {
    const fake = env.MAIL_FAKE_URL;
    if (!fake || !env.MAIL_FAKE_SECRET) return { address: account.email, messages: null };
    try {
      const res = await fetch(`${fake}/messages?to=${encodeURIComponent(account.email)}`, {
        cache: "no-store",
        headers: { authorization: `Bearer ${env.MAIL_FAKE_SECRET}` },
        signal: AbortSignal.timeout(3000),
      });
      if (!res.ok) return { address: account.email, messages: null };
      return { address: account.email, messages: mailFor((await res.json()) as FakeMessage[], account.email) };
    } catch {
      return { address: account.email, messages: null };
    }
  });
}
