"use server";

import { AuthError } from "next-auth";
import { redirect } from "next/navigation";
import { after } from "next/server";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import {
  acceptAsMemberSchema,
  acceptNewAccountSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
} from "@/lib/validation/auth";
import { formValues, type ActionState } from "@/lib/http/action";
import {
  acceptInvitationAsMember,
  acceptInvitationAsNewAccount,
  requestPasswordReset,
  resetPassword,
} from "@/lib/ops/accounts";
import { sessionCaller } from "@/lib/ops/caller";
import { signIn, signOut } from "./config";
import { throttledMessage } from "./throttle-policy";
import type { z } from "zod";
import { log } from "@/lib/log";

export type SignInState = { error?: string; email?: string };

const safeReturn = (url: string) =>
  url.startsWith("/") && !url.startsWith("//") && !url.startsWith("/\\") ? url : "/dashboard";

export async function signInAction(_prev: SignInState, form: FormData): Promise<SignInState> {
  const email = String(form.get("email") ?? "").trim();
  const password = String(form.get("password") ?? "");
  const callbackUrl = safeReturn(String(form.get("callbackUrl") ?? "/dashboard"));
  if (!email || !password) return { error: "Enter your e-mail address and password.", email };
  try {
    await signIn("credentials", { email, password, redirectTo: callbackUrl });
    return {};
  } catch (err) {
    if (err instanceof AuthError) {
      const code = (err as AuthError & { code?: string }).code;
      if (code === "throttled") return { error: throttledMessage(env.SIGNIN_THROTTLE_SECONDS), email };
      return { error: "That e-mail address and password do not match an account.", email };
    }
    throw err;
  }
}

export async function signOutAction(): Promise<void> {
  await signOut({ redirectTo: "/sign-in?signedOut=1" });
}

function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) out[issue.path.join(".") || "_"] ??= issue.message;
  return out;
}

// Passwords are never sent back to the browser, even to refill a form.
const withoutSecrets = (form: FormData) =>
  Object.fromEntries(Object.entries(formValues(form)).filter(([k]) => k !== "password" && k !== "confirm"));

/** The same answer whether or not the address has an account; the e-mail goes out after responding. */
export async function requestPasswordResetAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const parsed = forgotPasswordSchema.safeParse(formValues(form));
  if (!parsed.success)
    return {
      ok: false,
      message: "Please correct the highlighted field.",
      fieldErrors: fieldErrors(parsed.error),
      values: formValues(form),
    };
  const { email } = parsed.data;
  after(() =>
    requestPasswordReset({ email }).catch((err) =>
      log.error({ err, operation: "password-reset.mail" }, "password reset e-mail failed"),
    ),
  );
  return {
    ok: true,
    message: `If an account uses ${email}, a link to choose a new password is on its way. It works once, for one hour.`,
    values: { email },
  };
}

export async function resetPasswordAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const parsed = resetPasswordSchema.safeParse(formValues(form));
  if (!parsed.success)
    return {
      ok: false,
      message: "Please correct the highlighted fields.",
      fieldErrors: fieldErrors(parsed.error),
      values: withoutSecrets(form),
    };
  try {
    await resetPassword({ token: parsed.data.token, password: parsed.data.password });
  } catch (err) {
    if (err instanceof AppError) return { ok: false, message: err.message, values: withoutSecrets(form) };
    throw err;
  }
  redirect("/sign-in?reset=1");
}

/** Anyone holding a valid invitation link may create the invited account; the link is the key. */
export async function acceptInvitationAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const parsed = acceptNewAccountSchema.safeParse(formValues(form));
  if (!parsed.success)
    return {
      ok: false,
      message: "Please correct the highlighted fields.",
      fieldErrors: fieldErrors(parsed.error),
      values: withoutSecrets(form),
    };
  let joined: Awaited<ReturnType<typeof acceptInvitationAsNewAccount>>;
  try {
    joined = await acceptInvitationAsNewAccount(parsed.data);
  } catch (err) {
    if (err instanceof AppError) return { ok: false, message: err.message, values: withoutSecrets(form) };
    throw err;
  }
  redirect(
    `/sign-in?${new URLSearchParams({ notice: "joined", email: joined.email, callbackUrl: `/labs/${joined.lab.slug}` })}`,
  );
}

/** A signed-in person accepts an invitation addressed to their own account. */
export async function joinLabAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const parsed = acceptAsMemberSchema.safeParse(formValues(form));
  if (!parsed.success) return { ok: false, message: "This invitation link is not valid." };
  let slug: string;
  try {
    const joined = await acceptInvitationAsMember(await sessionCaller(), { token: parsed.data.token });
    slug = joined.lab.slug;
  } catch (err) {
    if (err instanceof AppError) return { ok: false, message: err.message };
    throw err;
  }
  redirect(`/labs/${slug}`);
}
