import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

// One transport per process over SMTP_URL: the local fake in development and tests, a real
// relay in production; nothing else changes.
const globalForMail = globalThis as unknown as { forkwallMail?: Transporter };

function transport(): Transporter {
  globalForMail.forkwallMail ??= nodemailer.createTransport(env.SMTP_URL, { from: env.MAIL_FROM });
  return globalForMail.forkwallMail;
}

export type OutgoingMail = { to: string | string[]; subject: string; text: string; html?: string };

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transport().sendMail({ from: env.MAIL_FROM, ...mail });
}

export const mailFakeConfigured = () => Boolean(env.MAIL_FAKE_URL);
