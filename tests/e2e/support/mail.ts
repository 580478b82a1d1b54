// Reads what the SMTP fake received, over the fake's own HTTP interface (not the app's tables).
import { expect } from "@playwright/test";
import { query } from "./db";

export type FakeMessage = { id: number; envelopeTo: string[]; subject: string; text: string };

const fakeUrl = () => {
  const url = process.env.MAIL_FAKE_URL;
  if (!url) throw new Error("MAIL_FAKE_URL is not set: run the browser tests through npm test");
  return url;
};

export async function mailTo(address: string): Promise<FakeMessage[]> {
  const res = await fetch(`${fakeUrl()}/messages?to=${encodeURIComponent(address)}`, {
    headers: { authorization: `Bearer ${process.env.MAIL_FAKE_SECRET ?? ""}` },
  });
  return (await res.json()) as FakeMessage[];
}

/** Waits until `count` messages reached the address and returns them (e-mails may go out after the response). */
export async function waitForMail(address: string, count = 1): Promise<FakeMessage[]> {
  let found: FakeMessage[] = [];
  await expect
    .poll(async () => (found = await mailTo(address)).length, { message: `e-mail to ${address}`, timeout: 15_000 })
    .toBeGreaterThanOrEqual(count);
  return found;
}

export function linkIn(message: FakeMessage, kind: "invite" | "reset-password" | "verify-email"): string {
  const m = message.text.match(new RegExp(`https?://\\S+/${kind}/[A-Za-z0-9_-]{43}`));
  if (!m) throw new Error(`no ${kind} link in: ${message.text}`);
  return m[0];
}

/**
 * Waits until no stale-copy notice waits for its digest (they go out one quiet period after a
 * lab's last change, STALE_MAIL_QUIET_SECONDS), so a test counting e-mails starts from a settled
 * mailbox rather than catching an earlier test's digest.
 */
export async function settleStaleMail(): Promise<void> {
  await expect
    .poll(
      async () => (await query<{ n: number }>("SELECT COUNT(*) AS n FROM stale_notices WHERE sent_at IS NULL"))[0]!.n,
      {
        message: "stale-copy digests still waiting",
        timeout: 15_000,
      },
    )
    .toBe(0);
  // The claim commits before the SMTP send; give the send a moment to land.
  await new Promise((r) => setTimeout(r, 500));
}
