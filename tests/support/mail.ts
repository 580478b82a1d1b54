// Reads what the SMTP fake received, over the fake's own HTTP interface (not the app's tables).
// Framework-free, so integration (vitest) and browser (Playwright) tests share it.
import { until } from "./poll";

export type FakeMessage = { id: number; envelopeTo: string[]; subject: string; text: string };

function fake() {
  const url = process.env.MAIL_FAKE_URL;
  if (!url) throw new Error("MAIL_FAKE_URL is not set: run the tests through npm test");
  return { url, secret: process.env.MAIL_FAKE_SECRET ?? "" };
}

export async function mailTo(address: string): Promise<FakeMessage[]> {
  const { url, secret } = fake();
  const res = await fetch(`${url}/messages?to=${encodeURIComponent(address)}`, {
    headers: { authorization: `Bearer ${secret}` },
  });
  return (await res.json()) as FakeMessage[];
}

/** Waits until `count` messages reached the address and returns them (e-mail may go out after the response). */
export function waitForMail(address: string, count = 1): Promise<FakeMessage[]> {
  return until(
    `${count} e-mail(s) to ${address}`,
    () => mailTo(address),
    (found) => found.length >= count,
  );
}

export type LinkKind = "invite" | "reset-password" | "verify-email";

/** The single-use link of `kind` in a message (or its text): the whole URL and its token. */
export function linkIn(message: FakeMessage | string, kind: LinkKind): { url: string; token: string } {
  const text = typeof message === "string" ? message : message.text;
  const m = text.match(new RegExp(`https?://\\S+/${kind}/([A-Za-z0-9_-]{43})`));
  if (!m) throw new Error(`no ${kind} link in: ${text}`);
  return { url: m[0], token: m[1]! };
}
