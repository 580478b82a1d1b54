// What the sign-in page says above the form. The query string carries message codes only:
// text from a URL is never shown (a crafted link could otherwise put any words on our page).
import { throttledMessage } from "./throttle-policy";

export type SignInQuery = { notice?: string; error?: string; code?: string; signedOut?: string; reset?: string };

const NOTICES: Record<string, string> = {
  joined: "Your account is ready and you have joined the lab. Sign in to open it.",
  reset: "Your password was changed. Sign in with the new one.",
  "signed-out": "You are signed out.",
  verified: "Your e-mail address is confirmed. Sign in to create your lab.",
  "password-changed": "Your password was changed and every session ended. Sign in with the new one.",
};

export function signInNotice(q: SignInQuery, throttleSeconds: number): { ok: boolean; message: string } | null {
  const code = typeof q.notice === "string" ? q.notice : q.reset ? "reset" : q.signedOut ? "signed-out" : undefined;
  if (code && Object.hasOwn(NOTICES, code)) return { ok: true, message: NOTICES[code]! };
  // Errors from next-auth's own endpoint (a sign-in posted without JavaScript or by a script).
  if (q.error && q.code === "throttled") return { ok: false, message: throttledMessage(throttleSeconds) };
  if (q.error === "CredentialsSignin")
    return { ok: false, message: "That e-mail address and password do not match an account." };
  if (q.error) return { ok: false, message: "Sign-in did not work. Please try again." };
  return null;
}
