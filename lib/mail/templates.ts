import { formatDateTime } from "@/lib/format/dates";
import { ROLE_LABELS, type Role } from "@/lib/permissions";

// Plain-text messages (with an equivalent minimal HTML part) for the e-mails Forkwall sends.
export type MailContent = { subject: string; text: string; html: string };

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/** The one date format (lib/format/dates.ts) with the zone named, for text read outside the app. */
export function formatInZone(date: Date, timeZone: string): string {
  return `${formatDateTime(date, timeZone)} ${timeZone === "UTC" ? "UTC" : `(${timeZone})`}`;
}

/** For mail about an account rather than a lab (password resets): no lab zone applies. */
export function formatUtc(date: Date): string {
  return formatInZone(date, "UTC");
}

/**
 * A lab's name as mail quotes it: plain text in quotes. Names are chosen by whoever creates a
 * lab, so a name is never made into a link (the HTML part escapes it outside any <a>).
 */
export const quotedLabName = (name: string) => `"${name}"`;

// Only a paragraph that ends with the link on its own line gets an <a>, around the link alone.
function toHtml(paragraphs: string[], link: { href: string; label: string }): string {
  const tail = `\n${link.href}`;
  const anchor = `<a href="${escapeHtml(link.href)}">${escapeHtml(link.href)}</a>`;
  const body = paragraphs
    .map((p) =>
      p.endsWith(tail) ? `<p>${escapeHtml(p.slice(0, -link.href.length))}${anchor}</p>` : `<p>${escapeHtml(p)}</p>`,
    )
    .join("\n");
  return `<!doctype html><html><body style="font-family:sans-serif;line-height:1.5">\n${body}\n</body></html>`;
}

export function invitationMail(p: {
  labName: string;
  role: Role;
  inviterName: string;
  link: string;
  expiresAt: Date;
  /** The lab's IANA time zone; the expiry is shown in it. */
  timeZone?: string;
}): MailContent {
  const paragraphs = [
    `${p.inviterName} invites you to join the lab ${quotedLabName(p.labName)} on Forkwall as ${ROLE_LABELS[p.role].toLowerCase()}.`,
    `Accept the invitation here:\n${p.link}`,
    `The link works once and expires at ${formatInZone(p.expiresAt, p.timeZone ?? "UTC")}. If you already have a Forkwall account under this address, sign in with it to accept.`,
    "If you did not expect this invitation, you can ignore this e-mail.",
  ];
  return {
    subject: `Invitation to join the lab ${quotedLabName(p.labName)} on Forkwall`,
    text: paragraphs.join("\n\n") + "\n",
    html: toHtml(paragraphs, { href: p.link, label: "Accept" }),
  };
}

export function passwordResetMail(p: { link: string; expiresAt: Date }): MailContent {
  const paragraphs = [
    "Someone (hopefully you) asked to reset the password of your Forkwall account.",
    `Choose a new password here:\n${p.link}`,
    `The link works once and expires at ${formatUtc(p.expiresAt)}. If you did not ask for this, ignore this e-mail: your password stays as it is.`,
  ];
  return {
    subject: "Reset your Forkwall password",
    text: paragraphs.join("\n\n") + "\n",
    html: toHtml(paragraphs, { href: p.link, label: "Reset" }),
  };
}
