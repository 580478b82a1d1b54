// The e-mails of sign-up and the account page. Plain text: each carries one link to open.
import { formatUtc } from "../templates";

export type AccountMail = { subject: string; text: string };

const join = (paragraphs: string[]) => paragraphs.join("\n\n") + "\n";

export function verifySignUpMail(p: { name: string; link: string; expiresAt: Date }): AccountMail {
  return {
    subject: "Confirm your e-mail address for Forkwall",
    text: join([
      `Hello ${p.name},`,
      "Someone (hopefully you) created a Forkwall account with this address. Confirm it here:",
      p.link,
      `The link works once and expires at ${formatUtc(p.expiresAt)}. Until the address is confirmed the account can do nothing but ask for a new link.`,
      "If you did not sign up, ignore this e-mail: the account stays unconfirmed.",
    ]),
  };
}

export function alreadyHaveAccountMail(p: { signInLink: string; resetLink: string }): AccountMail {
  return {
    subject: "You already have a Forkwall account",
    text: join([
      "Someone (hopefully you) tried to sign up for Forkwall with this address, but it already has an account. Nothing was changed.",
      `Sign in here:\n${p.signInLink}`,
      `Forgot the password? Choose a new one here:\n${p.resetLink}`,
      "If this was not you, you can ignore this e-mail.",
    ]),
  };
}

export function verifyNewEmailMail(p: { name: string; link: string; expiresAt: Date }): AccountMail {
  return {
    subject: "Confirm your new e-mail address for Forkwall",
    text: join([
      `Hello ${p.name},`,
      "You asked to use this address for your Forkwall account. It takes effect when you confirm it here:",
      p.link,
      `The link works once and expires at ${formatUtc(p.expiresAt)}. Until then your account keeps its old address.`,
      "If you did not ask for this, ignore this e-mail.",
    ]),
  };
}

export function emailTakenMail(): AccountMail {
  return {
    subject: "This address already has a Forkwall account",
    text: join([
      "Someone asked to move a Forkwall account to this address, but another account already uses it, so nothing was changed.",
      "If this was you, sign in with the account that has this address instead.",
    ]),
  };
}

export function emailChangedMail(p: { newEmail: string }): AccountMail {
  return {
    subject: "Your Forkwall e-mail address was changed",
    text: join([
      `Your Forkwall account now uses ${p.newEmail}. Sign-in and e-mails go to that address from now on.`,
      "If you did not make this change, reset your password from the sign-in page at once and tell your lab's manager.",
    ]),
  };
}
