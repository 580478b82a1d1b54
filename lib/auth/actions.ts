"use server";

import { AuthError } from "next-auth";
import { redirect } from "next/navigation";
import { after } from "next/server";
import { env } from "@/lib/env";
import {
  acceptAsMemberSchema,
  acceptNewAccountSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
} from "@/lib/validation/auth";
import { formValues, runAction, type ActionPayload, type ActionState } from "@/lib/http/action";
import { parseInput } from "@/lib/ops/operation";
import {
  acceptInvitationAsMember,
  acceptInvitationAsNewAccount,
  requestPasswordReset,
  resetPassword,
} from "@/lib/ops/accounts";
import { signIn, signOut } from "./config";
import { throttledMessage } from "./throttle-policy";
import { log } from "@/lib/log";

const safeReturn = (url: string) =>
  url.startsWith("/") && !url.startsWith("//") && !url.startsWith("/\\") ? url : "/dashboard";

export async function signInAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  const values = formValues(payload);
  const email = String(values.email ?? "").trim();
  const password = String(values.password ?? "");
  const callbackUrl = safeReturn(String(values.callbackUrl ?? "/dashboard"));
  const refused = (message: string): ActionState => ({ ok: false, message, values: { email } });
  if (!email || !password) return refused("Enter your e-mail address and password.");
  try {
    await signIn("credentials", { email, password, redirectTo: callbackUrl });
    return { ok: true };
  } catch (err) {
    if (err instanceof AuthError) {
      const code = (err as AuthError & { code?: string }).code;
      if (code === "throttled") return refused(throttledMessage(env.SIGNIN_THROTTLE_SECONDS));
      return refused("That e-mail address and password do not match an account.");
    }
    throw err;
  }
}

/** Ends the caller's own session; a plain form action (no state, no input). */
export async function signOutAction(): Promise<void> {
  await signOut({ redirectTo: "/sign-in?signedOut=1" });
}

// Passwords are never sent back to the browser, even to refill a form.
const SECRETS = { secret: ["password", "confirm"] };

/** The same answer whether or not the address has an account; the e-mail goes out after responding. */
export async function requestPasswordResetAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(payload, async (_caller, values) => {
    const { email } = parseInput(forgotPasswordSchema, values);
    after(() =>
      requestPasswordReset({ email }).catch((err) =>
        log.error({ err, operation: "password-reset.mail" }, "password reset e-mail failed"),
      ),
    );
    const message = `If an account uses ${email}, a link to choose a new password is on its way. It works once, for one hour.`;
    return { ok: true, message, values: { email } };
  });
}

export async function resetPasswordAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(
    payload,
    async (_caller, values) => {
      const { token, password } = parseInput(resetPasswordSchema, values);
      await resetPassword({ token, password });
      redirect("/sign-in?reset=1");
    },
    SECRETS,
  );
}

/** Anyone holding a valid invitation link may create the invited account; the link is the key. */
export async function acceptInvitationAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  return runAction(
    payload,
    async (_caller, values) => {
      const input = parseInput(acceptNewAccountSchema, values);
      const joined = await acceptInvitationAsNewAccount(input);
      // The person just chose this password: sign them in rather than ask for it again.
      try {
        await signIn("credentials", {
          email: joined.email,
          password: input.password,
          redirectTo: `/labs/${joined.lab.slug}`,
        });
      } catch (err) {
        if (!(err instanceof AuthError)) throw err;
      }
      const query = new URLSearchParams({
        notice: "joined",
        email: joined.email,
        callbackUrl: `/labs/${joined.lab.slug}`,
      });
      redirect(`/sign-in?${query}`);
    },
    SECRETS,
  );
}

/** A signed-in person accepts an invitation addressed to their own account. */
export async function joinLabAction(_prev: ActionState, payload: ActionPayload): Promise<ActionState> {
  let slug: string | null = null;
  const state = await runAction(payload, async (caller, values) => {
    const parsed = acceptAsMemberSchema.safeParse(values);
    if (!parsed.success) return { ok: false, message: "This invitation link is not valid." };
    slug = (await acceptInvitationAsMember(caller, { token: parsed.data.token })).lab.slug;
    return { ok: true };
  });
  if (slug) redirect(`/labs/${slug}`);
  return state;
}
